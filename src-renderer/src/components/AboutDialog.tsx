import { useEffect, useRef } from 'react';
import { CAUTIONS } from '@shared/text/cautions';

/** About Plumbline, with the cautions (also what the desktop Help menu shows). */
export function AboutDialog({ version, onClose }: { readonly version: string | null; readonly onClose: () => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    dialog.current?.showModal();
  }, []);
  return (
    <dialog ref={dialog} aria-labelledby="about-title" onCancel={onClose} onClose={onClose} data-testid="about">
      <h2 id="about-title">About Plumbline{version ? ` ${version}` : ''}</h2>
      <p>Sample sizes for the external validation of clinical prediction models across sites.</p>
      <ul>
        {CAUTIONS.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
      <p className="muted small">Open-source under the MIT licence. Works offline; makes no network requests.</p>
      <button type="button" onClick={onClose}>
        Close
      </button>
    </dialog>
  );
}
