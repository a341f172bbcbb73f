import { useEffect, useRef, useState, type FormEvent } from 'react';
import { MAX_UPLOAD_BYTES } from '@shared/limits';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { ProgressBar } from '@frontend/components/ui/progress-bar';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import type { UploadHandle } from '@frontend/lib/api-client';
import { formatBytes } from '@frontend/lib/format';
import { uploadHistorianFile, type UploadResponse } from '../api/upload-historian-file';

const MAX_MB = MAX_UPLOAD_BYTES / 1024 / 1024;

interface Props {
  unitId: string;
  onUploaded: (r: UploadResponse) => void;
  /** null when the person may import; otherwise why not, shown instead of the file picker */
  disabledReason: string | null;
}

/** Step 1 for people who may import; for the rest, who may, and where the imported files are listed. */
export function UploadStep(props: Props) {
  if (!props.disabledReason) return <UploadForm {...props} />;
  return (
    <section aria-label="Import data" className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-4">
      <h2>Import data</h2>
      <ReadOnlyReason reason={props.disabledReason} action="import historian data" />
      <p className="text-sm text-ink-soft">The files already imported for this unit, with their dates and counts, are listed under Imported files.</p>
    </section>
  );
}

/** Step 1: choose a historian export and send it, with a progress bar. */
function UploadForm({ unitId, onUploaded }: Omit<Props, 'disabledReason'>) {
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const handle = useRef<UploadHandle<UploadResponse> | null>(null);
  useEffect(() => () => handle.current?.abort(), []);

  const choose = (f: File | null) => {
    setError(null);
    if (f && f.size > MAX_UPLOAD_BYTES) {
      setFile(null);
      return setError(`${f.name} is ${formatBytes(f.size)}; files up to ${MAX_MB} MB can be imported. Split it by date range.`);
    }
    if (f && !/\.(csv|txt|xlsx)$/i.test(f.name)) setError('The name does not end in .csv or .xlsx; the upload will be tried, but other formats are refused.');
    setFile(f);
  };

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return setError('Choose a CSV or XLSX file first');
    setError(null);
    setProgress(0);
    handle.current = uploadHistorianFile(unitId, file, setProgress);
    handle.current.promise.then(
      (r) => {
        handle.current = null;
        setProgress(null);
        onUploaded(r);
      },
      (e: Error) => {
        handle.current = null;
        setProgress(null);
        setError(e.message);
      },
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Choose a file" className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4">
      <h2>1. Choose the historian export</h2>
      <p className="text-sm text-ink-soft">
        A CSV or XLSX file of up to {MAX_MB} MB, one row per time: timestamp, gross load, backpressure (or vacuum and barometer), CW inlet and outlet
        temperature and CW flow, in any column names and units. Nothing is stored until you confirm the columns and every row has been checked.
      </p>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Historian file (CSV or XLSX, up to {MAX_MB} MB)
        <input
          type="file"
          name="file"
          accept=".csv,.txt,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
          disabled={progress !== null}
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
          className="text-sm font-normal"
        />
      </label>
      {file && (
        <p className="text-xs text-ink-soft">
          {file.name}, {formatBytes(file.size)}
        </p>
      )}
      {progress !== null && <ProgressBar fraction={progress} label="Uploading" message={progress < 1 ? `Uploading ${file?.name}` : 'Reading the columns…'} />}
      {error && <Notice tone="fault">{error}</Notice>}
      <div className="flex gap-2">
        <Button type="submit" disabled={!file || progress !== null}>
          {progress !== null ? 'Uploading…' : 'Upload and map columns'}
        </Button>
        {progress !== null && (
          <Button variant="quiet" onClick={() => handle.current?.abort()}>
            Cancel upload
          </Button>
        )}
      </div>
    </form>
  );
}
