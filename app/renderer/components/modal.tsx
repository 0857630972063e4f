import { useEffect, useRef, type ReactNode } from 'react';

/** A modal dialog: focus moves into it, Tab stays inside it, and it is announced as a dialog. */
export function Modal(props: { title: string; children: ReactNode; onClose?: () => void }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    const focusable = () =>
      el
        ? [
            ...el.querySelectorAll<HTMLElement>(
              'button, [href], input, select, textarea, [tabindex]:not([tabindex="-1"])',
            ),
          ]
        : [];
    focusable()[0]?.focus();
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape' && props.onClose) props.onClose();
      if (e.key !== 'Tab') return;
      const f = focusable();
      if (f.length === 0) return;
      const first = f[0] as HTMLElement;
      const last = f[f.length - 1] as HTMLElement;
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [props]);
  return (
    <div className="modal-backdrop">
      <div className="modal" role="dialog" aria-modal="true" aria-label={props.title} ref={box}>
        <h2>{props.title}</h2>
        {props.children}
      </div>
    </div>
  );
}
