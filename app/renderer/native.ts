import type { MenuCommand, NativeBridge } from '../api/native-bridge';

declare global {
  // Augmenting the DOM's Window needs an interface: a type alias cannot merge.
  // eslint-disable-next-line @typescript-eslint/consistent-type-definitions
  interface Window {
    rideledgerNative?: NativeBridge;
  }
}

/** True in the desktop window, where the preload gives native dialogs and print-to-PDF. */
export const isDesktop = () => window.rideledgerNative !== undefined;

function browserDownload(name: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Saves text (CSV, a setup file): a native dialog in the desktop, a download in a browser. */
export async function textFileSave(
  defaultName: string,
  content: string,
  filter: { name: string; extensions: string[] },
): Promise<boolean> {
  const n = window.rideledgerNative;
  if (n)
    return (await n.saveTextFile({ title: `Save ${defaultName}`, defaultName, content, filters: [filter] }))
      .saved;
  browserDownload(
    defaultName,
    new Blob([content], { type: filter.extensions[0] === 'csv' ? 'text/csv' : 'application/json' }),
  );
  return true;
}

/** Saves a PNG given as a data URL. */
export async function imageFileSave(defaultName: string, dataUrl: string): Promise<boolean> {
  const base64 = dataUrl.slice(dataUrl.indexOf(',') + 1);
  const n = window.rideledgerNative;
  if (n)
    return (await n.saveImageFile({ title: `Save ${defaultName}`, defaultName, pngBase64: base64 })).saved;
  const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
  browserDownload(defaultName, new Blob([bytes], { type: 'image/png' }));
  return true;
}

/** Prints the page: to a PDF through Electron in the desktop, the browser's print dialog otherwise. */
export async function pagePrint(defaultName: string): Promise<void> {
  const n = window.rideledgerNative;
  if (n) await n.printToPdf({ title: 'Save the setup sheet as PDF', defaultName });
  else window.print();
}

/** Subscribes to the desktop menu's commands; a no-op in a browser, where keyboard shortcuts stand in. */
export function menuCommandsListen(listener: (c: MenuCommand) => void): () => void {
  const n = window.rideledgerNative;
  if (n) return n.onMenuCommand(listener);
  const onKey = (e: KeyboardEvent) => {
    if (!(e.ctrlKey || e.metaKey)) return;
    const key = e.key.toLowerCase();
    const command: MenuCommand | undefined =
      key === 's'
        ? 'save'
        : key === 'k'
          ? 'compare'
          : key === 'z'
            ? e.shiftKey
              ? 'redo'
              : 'undo'
            : key === 'y'
              ? 'redo'
              : undefined;
    if (!command) return;
    // Undo and redo in a text field belong to the field.
    if (
      (command === 'undo' || command === 'redo') &&
      (e.target as HTMLElement | null)?.closest('input, textarea')
    )
      return;
    e.preventDefault();
    listener(command);
  };
  window.addEventListener('keydown', onKey);
  return () => window.removeEventListener('keydown', onKey);
}
