import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '@frontend/components/ui/button';
import { linkClass } from '@frontend/components/ui/public-page';
import { importIsRunning, useImport } from '@frontend/features/imports/api/get-import';
import type { UploadResponse } from '@frontend/features/imports/api/upload-historian-file';
import { ImportHistory } from '@frontend/features/imports/components/import-history';
import { ImportOutcome } from '@frontend/features/imports/components/import-outcome';
import { MappingStep } from '@frontend/features/imports/components/mapping-step';
import { UploadStep } from '@frontend/features/imports/components/upload-step';
import { useUnitPage } from './unit-layout';

/**
 * A unit's historian data on one page: add a file (upload → map columns → progress and result) above, every file
 * imported below. The running import's id sits in the address, so a reload keeps watching it. People who may not
 * import see only the files and one line saying who may.
 */
export function UnitDataPage() {
  const { organisationId, unit, units, cannotWrite } = useUnitPage();
  const [search, setSearch] = useSearchParams();
  const [upload, setUpload] = useState<UploadResponse | null>(null);
  const importId = search.get('import');
  const queryClient = useQueryClient();
  const current = useImport(organisationId, importId);
  const finished = current.data && !importIsRunning(current.data.status);
  useEffect(() => {
    // when an import ends, the unit's data span and jobs changed: refresh the frame and the list of files
    if (finished) void queryClient.invalidateQueries({ queryKey: ['organisations', organisationId, 'units', unit.id] });
  }, [finished, importId, organisationId, unit.id, queryClient]);

  const startOver = () => {
    setUpload(null);
    setSearch({});
  };

  return (
    <div className="flex flex-col gap-6">
      {!cannotWrite && (
        <section className="flex flex-col gap-4" aria-label="Add a file">
          {!importId && !upload && <UploadStep unitId={unit.id} onUploaded={setUpload} disabledReason={null} />}
          {!importId && upload && (
            <MappingStep
              organisationId={organisationId}
              upload={upload}
              plantTimeZone={unit.plant.timeZone}
              designCwFlowM3s={unit.condenser?.designCwFlowM3s ?? null}
              units={units}
              onStarted={(view) => {
                setUpload(null);
                setSearch({ import: view.id });
              }}
              onCancel={startOver}
            />
          )}
          {importId && <ImportOutcome organisationId={organisationId} importId={importId} plantTimeZone={unit.plant.timeZone} />}
          {importId && finished && (
            <div className="flex flex-wrap items-center gap-4 text-sm">
              <Button variant="quiet" onClick={startOver}>
                Import another file
              </Button>
              <Link className={linkClass} to={`/units/${unit.id}`}>
                Unit summary
              </Link>
            </div>
          )}
          {!unit.turbine && !importId && (
            <p className="text-xs text-ink-soft">
              The turbine is not set up yet: without its rating the low-load and steadiness checks are skipped for this import (physics checks still run).{' '}
              <Link className={linkClass} to={`/units/${unit.id}/setup`}>
                Set up the turbine
              </Link>
            </p>
          )}
        </section>
      )}
      <section className="flex flex-col gap-3" aria-label="Imported files">
        <div>
          <h2>Imported files</h2>
          <p className="mt-1 text-sm text-ink-soft">
            Every file imported for this unit, newest first.{cannotWrite ? '' : ' Undo removes the rows an import brought and recomputes the unit.'}
          </p>
        </div>
        <ImportHistory organisationId={organisationId} unitId={unit.id} plantTimeZone={unit.plant.timeZone} cannotWrite={cannotWrite} />
      </section>
    </div>
  );
}
