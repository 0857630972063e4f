import type { NativeInput, NativeName, NativeOutput } from './native-contract';

// Kept apart from the zod contract so that the sandboxed preload bundles no validation code:
// validation happens in main, where the input arrives.

/** Commands the desktop menu sends to the page (keyboard shortcuts included). */
export const MENU_COMMANDS = ['save', 'new-setup', 'compare', 'undo', 'redo', 'print'] as const;
export type MenuCommand = (typeof MENU_COMMANDS)[number];

/** What the preload exposes as `window.rideledgerNative`. */
export type NativeBridge = { [N in NativeName]: (input: NativeInput<N>) => Promise<NativeOutput<N>> } & {
  onMenuCommand: (listener: (command: MenuCommand) => void) => () => void;
};

/** IPC channel of a native helper. */
export const nativeChannel = (name: NativeName) => `rideledger-native:${name}`;
export const MENU_CHANNEL = 'rideledger-menu';
