/**
 * Lets the user pick a text file: a native dialog in the desktop window, the browser's file
 * picker otherwise. Resolves to null when they cancel.
 */
export async function textFilePick(options: {
  accept: string;
  title: string;
  filterName: string;
  extensions: string[];
}): Promise<{ name: string; content: string } | null> {
  const n = window.rideledgerNative;
  if (n)
    return n.openTextFile({
      title: options.title,
      filters: [{ name: options.filterName, extensions: options.extensions }],
    });
  return new Promise((done) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = options.accept;
    input.style.display = 'none';
    input.addEventListener('change', () => {
      const file = input.files?.[0];
      input.remove();
      if (!file) {
        done(null);
        return;
      }
      file.text().then(
        (content) => done({ name: file.name, content }),
        () => done(null),
      );
    });
    input.addEventListener('cancel', () => {
      input.remove();
      done(null);
    });
    document.body.append(input);
    input.click();
  });
}
