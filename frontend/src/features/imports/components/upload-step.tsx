import { useEffect, useRef, useState, type FormEvent } from 'react';
import { MAX_UPLOAD_BYTES } from '@shared/limits';
import { MAX_TAG_FILES } from '@shared/schemas/imports';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { ProgressBar } from '@frontend/components/ui/progress-bar';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import type { UploadHandle } from '@frontend/lib/api-client';
import { formatBytes } from '@frontend/lib/format';
import { uploadHistorianFiles, type UploadResponse } from '../api/upload-historian-file';

const MAX_MB = MAX_UPLOAD_BYTES / 1024 / 1024;
/** Several files of one tag each, together (the server's limit). */
const MAX_FILES_BYTES = 512 * 1024 * 1024;

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

/** Step 1: choose a historian export (or files of one tag each, or a ZIP of them) and send it, with a progress bar. */
function UploadForm({ unitId, onUploaded }: Omit<Props, 'disabledReason'>) {
  const [files, setFiles] = useState<File[]>([]);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const handle = useRef<UploadHandle<UploadResponse> | null>(null);
  useEffect(() => () => handle.current?.abort(), []);

  const choose = (chosen: File[]) => {
    setError(null);
    setFiles([]);
    const big = chosen.find((f) => f.size > MAX_UPLOAD_BYTES);
    if (big) return setError(`${big.name} is ${formatBytes(big.size)}; files up to ${MAX_MB} MB can be imported. Split it by date range.`);
    if (chosen.length > MAX_TAG_FILES) return setError(`${chosen.length} files chosen; at most ${MAX_TAG_FILES} files of one tag each are imported together.`);
    const total = chosen.reduce((n, f) => n + f.size, 0);
    if (chosen.length > 1 && total > MAX_FILES_BYTES) {
      return setError(
        `The files come to ${formatBytes(total)}; up to ${MAX_FILES_BYTES / 1024 / 1024} MB are imported together. Choose fewer or shorter files.`,
      );
    }
    const odd = chosen.find((f) => !/\.(csv|txt|xlsx|zip)$/i.test(f.name));
    if (odd) setError(`${odd.name} does not end in .csv, .xlsx or .zip; the upload will be tried, but other formats are refused.`);
    setFiles(chosen);
  };

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (files.length === 0) return setError('Choose a CSV or XLSX file first');
    setError(null);
    setProgress(0);
    handle.current = uploadHistorianFiles(unitId, files, setProgress);
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
        temperature and CW flow, in any column names and units — or one row per tag per time. Nothing is stored until you confirm the columns and every row has
        been checked.
      </p>
      <p className="text-sm text-ink-soft">
        Exported one file per tag? Choose them all at once (up to {MAX_TAG_FILES}), or one ZIP of them: they are put on one time grid and imported together.
      </p>
      <label className="flex flex-col gap-1 text-sm font-medium">
        Historian file or files (CSV, XLSX or ZIP, up to {MAX_MB} MB each)
        <input
          type="file"
          name="file"
          multiple
          accept=".csv,.txt,.xlsx,.zip,text/csv,application/zip,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
          disabled={progress !== null}
          onChange={(e) => choose(Array.from(e.target.files ?? []))}
          className="text-sm font-normal"
        />
      </label>
      {files.length === 1 && (
        <p className="text-xs text-ink-soft">
          {files[0]!.name}, {formatBytes(files[0]!.size)}
        </p>
      )}
      {files.length > 1 && (
        <details className="text-xs text-ink-soft" data-testid="chosen-files">
          <summary className="cursor-pointer">
            {files.length} files of one tag each, {formatBytes(files.reduce((n, f) => n + f.size, 0))}
          </summary>
          <ul className="ml-5 list-disc">
            {files.map((f) => (
              <li key={f.name} className="break-all">
                {f.name}, {formatBytes(f.size)}
              </li>
            ))}
          </ul>
        </details>
      )}
      {progress !== null && (
        <ProgressBar
          fraction={progress}
          label="Uploading"
          message={progress < 1 ? `Uploading ${files.length === 1 ? files[0]!.name : `${files.length} files`}` : 'Reading the columns…'}
        />
      )}
      {error && <Notice tone="fault">{error}</Notice>}
      <div className="flex gap-2">
        <Button type="submit" disabled={files.length === 0 || progress !== null}>
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
