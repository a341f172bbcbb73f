import { Button } from './button';

/** The buttons under an add-or-change form: Cancel only while changing, one submit that says what it does. */
export function FormActions({ editing, pending, addLabel, saveLabel, onCancel }: { editing: boolean; pending: boolean; addLabel: string; saveLabel: string; onCancel?: () => void }) {
  return (
    <div className="flex gap-2">
      {editing && (
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      )}
      <Button type="submit" disabled={pending}>
        {pending ? 'Saving…' : editing ? saveLabel : addLabel}
      </Button>
    </div>
  );
}
