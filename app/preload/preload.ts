// The desktop page's only bridge to the native side: exactly the native contract's helpers and
// the menu's commands. Runs sandboxed; bundled to one CommonJS file (it may require only electron).
import { contextBridge, ipcRenderer } from 'electron';
import {
  MENU_CHANNEL,
  MENU_COMMANDS,
  nativeChannel,
  type MenuCommand,
  type NativeBridge,
} from '../api/native-bridge';
import type { NativeName } from '../api/native-contract';

const invoke =
  <N extends NativeName>(name: N) =>
  (input: unknown) =>
    ipcRenderer.invoke(nativeChannel(name), input);

const bridge = {
  openTextFile: invoke('openTextFile'),
  saveTextFile: invoke('saveTextFile'),
  saveImageFile: invoke('saveImageFile'),
  printToPdf: invoke('printToPdf'),
  onMenuCommand: (listener: (command: MenuCommand) => void) => {
    const wrapped = (_event: unknown, command: unknown) => {
      if ((MENU_COMMANDS as readonly unknown[]).includes(command)) listener(command as MenuCommand);
    };
    ipcRenderer.on(MENU_CHANNEL, wrapped);
    return () => {
      ipcRenderer.removeListener(MENU_CHANNEL, wrapped);
    };
  },
} satisfies NativeBridge;

contextBridge.exposeInMainWorld('rideledgerNative', bridge);
