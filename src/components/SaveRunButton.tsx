/** "Save run into the scenario", and what happened. */
export function SaveRunButton({ onSave, saved }: { onSave: () => void; saved: boolean }) {
  return (
    <div className="flex items-center gap-3">
      <button
        type="button"
        onClick={onSave}
        className="rounded border border-teal px-3 py-1 text-sm text-teal"
      >
        Save run into the scenario
      </button>
      {saved && <span className="text-sm text-teal">Saved with its seed.</span>}
    </div>
  );
}
