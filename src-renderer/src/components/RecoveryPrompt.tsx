import type { ResponseOf } from '@shared/model/contract';

type Item = ResponseOf<'listRecovery'>['items'][number];

/** After a crash: unsaved work found in the recovery area, offered for restoring. */
export function RecoveryPrompt({
  items,
  onRestore,
  onDiscard,
  onLater,
}: {
  readonly items: readonly Item[];
  readonly onRestore: (item: Item) => void;
  readonly onDiscard: (item: Item) => void;
  readonly onLater: () => void;
}) {
  return (
    <section className="status warn-mark recovery" role="alertdialog" aria-labelledby="recovery-title" data-testid="recovery">
      <h2 id="recovery-title">Unsaved work was found</h2>
      <p>Plumbline did not close cleanly last time. These plans had changes that were not saved:</p>
      <ul>
        {items.map((item) => (
          <li key={item.documentId}>
            <strong>{item.projectName}</strong> ({item.originalPath ?? 'never saved'}), autosaved{' '}
            {new Date(item.savedAt).toLocaleString()}{' '}
            <button type="button" onClick={() => onRestore(item)}>
              Restore
            </button>{' '}
            <button type="button" onClick={() => onDiscard(item)}>
              Discard
            </button>
          </li>
        ))}
      </ul>
      <button type="button" onClick={onLater}>
        Decide later
      </button>
    </section>
  );
}
