import { Button } from './button';

/** The buttons under an add-or-change form: Cancel while changing (or when asked for), one submit that says what it does. */
export function FormActions({
  editing,
  pending,
  addLabel,
  saveLabel,
  onCancel,
  cancellable = editing,
}: {
  editing: boolean;
  pending: boolean;
  addLabel: string;
  saveLabel: string;
  onCancel?: () => void;
  /** a new-item form opened from a button can be closed again too */
  cancellable?: boolean;
}) {
  return (
    <div className="flex gap-2">
      {cancellable && (
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
