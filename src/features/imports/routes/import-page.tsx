import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { importFields, importMappingSchema, type ImportField, type ImportMapping } from '../../../../shared/schemas/imports';
import { FieldMessage, FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Button } from '../../../components/ui/button';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { importIsIncomplete, useCommitImport, useInspect, usePreview, useRememberedMappings } from '../api/imports';
import { ProblemRows } from '../components/problem-rows';
import { useWatchUnit } from '../../../app/use-live-updates';

const selectClass = 'rounded-md border border-line bg-field px-2 py-1';
const fieldKeys = Object.keys(importFields) as ImportField[];

const rows = (n: number) => `${n} ${n === 1 ? 'row' : 'rows'}`;

function errorText(error: Error | null) {
  if (!error) return null;
  if (error instanceof ApiError && Object.keys(error.fields).length) return `${error.message}: ${Object.values(error.fields).join('; ')}`;
  return error.message;
}

export function ImportPage() {
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const remembered = useRememberedMappings(unitId);
  const inspect = useInspect(unitId);
  const preview = usePreview(unitId);
  const commit = useCommitImport(unitId);
  const [file, setFile] = useState<File | null>(null);
  const form = useSchemaForm(importMappingSchema, { defaultValues: { source: '', timeColumn: '', columns: {} } });
  const mapping = useWatch({ control: form.control }) as ImportMapping;
  const headers = inspect.data?.headers ?? [];

  const chooseFile = (chosen: File | null) => {
    setFile(chosen);
    preview.reset();
    commit.reset();
    if (!chosen) return;
    inspect.mutate(chosen, {
      onSuccess: (data) => {
        // Start from the last mapping used for this unit whose columns the file has.
        const fit = remembered.data?.find((m) => data.headers.includes(m.mapping.timeColumn));
        if (fit) form.reset(fit.mapping);
      },
    });
  };
  const setColumn = (field: ImportField, column: string, unit?: string) => {
    const columns = { ...form.getValues('columns') };
    if (!column) delete columns[field];
    else columns[field] = { column, unit: unit ?? columns[field]?.unit ?? importFields[field].units[0] };
    form.setValue('columns', columns, { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
  };

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Import from a historian</h1>
          <p className="text-muted">{unit ? `${unit.name} · ` : ''}CSV (UTF-8) with a header row, at most 10 MB. Rows already imported are skipped.</p>
        </div>
        <UnitPicker />
      </div>
      <CautionNote />
      <label className="flex flex-col gap-1 rounded-lg border border-line bg-panel p-3 font-bold">
        1 · Choose the file
        <input type="file" accept=".csv,text/csv" onChange={(e) => chooseFile(e.target.files?.[0] ?? null)} />
      </label>
      {inspect.error ? <Notice kind="error">{errorText(inspect.error)}</Notice> : null}
      {inspect.data ? (
        <form
          aria-label="Map the columns"
          className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
          noValidate
          onSubmit={form.submit(async (checked) => {
            if (file) await preview.mutateAsync({ file, mapping: checked });
          })}
        >
          <h2 className="font-bold">2 · Map the columns ({inspect.data.rowCount} rows)</h2>
          <div className="grid gap-3 sm:grid-cols-2">
            <label className="flex flex-col text-sm">
              Source name (remembered with this mapping)
              <input className={selectClass} {...form.register('source')} {...form.describe('source')} />
              <FieldMessage {...form.messageFor('source')} />
            </label>
            <label className="flex flex-col text-sm">
              Time column (ISO 8601; without an offset read as station time{unit ? `, ${unit.timeZone}` : ''})
              <select className={selectClass} {...form.register('timeColumn')} {...form.describe('timeColumn')}>
                <option value="">Choose…</option>
                {headers.map((h) => (
                  <option key={h}>{h}</option>
                ))}
              </select>
              <FieldMessage {...form.messageFor('timeColumn')} />
            </label>
          </div>
          <table className="text-sm">
            <thead>
              <tr className="text-left text-muted">
                <th>Reading</th>
                <th>Column</th>
                <th>Unit</th>
              </tr>
            </thead>
            <tbody>
              {fieldKeys.map((field) => (
                <tr key={field}>
                  <td className="pr-2">{importFields[field].label}</td>
                  <td className="pr-2">
                    <select aria-label={`Column for ${importFields[field].label}`} className={selectClass} value={mapping.columns?.[field]?.column ?? ''} onChange={(e) => setColumn(field, e.target.value)}>
                      <option value="">— not in file —</option>
                      {headers.map((h) => (
                        <option key={h}>{h}</option>
                      ))}
                    </select>
                    <FieldMessage message={form.error(`columns.${field}`)} className="block text-alarm" />
                  </td>
                  <td>
                    <select
                      aria-label={`Unit for ${importFields[field].label}`}
                      className={selectClass}
                      disabled={!mapping.columns?.[field]}
                      value={mapping.columns?.[field]?.unit ?? importFields[field].units[0]}
                      onChange={(e) => setColumn(field, mapping.columns![field]!.column, e.target.value)}
                    >
                      {importFields[field].units.map((u) => (
                        <option key={u}>{u}</option>
                      ))}
                    </select>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <FormFailure form={form} />
          <Button type="submit" tone="plain" disabled={preview.isPending}>
            3 · Check every row
          </Button>
        </form>
      ) : null}
      {preview.data ? (
        <div className="flex flex-col gap-3">
          <Notice kind="info">
            <span data-testid="import-time-zone">Times without an offset are read as station time ({preview.data.timeZone}); times with an offset or Z keep it.</span>{' '}
            {preview.data.counts.valid} rows ready to import · {preview.data.counts.invalid} with problems · {preview.data.counts.duplicate} already imported or
            repeated. A value outside its physical range is a row problem; one outside the unit’s plausible range is imported, marked. repeated. Rows are stored in batches: if the import stops part-way, the batches already stored stay, and importing the same file again adds
            only the rest.
          </Notice>
          <ProblemRows rows={preview.data.rows} timeZone={preview.data.timeZone} />
          <Button disabled={!preview.data.counts.valid || commit.isPending || commit.isSuccess} onClick={() => file && commit.mutate({ file, mapping })}>
            4 · Import {preview.data.counts.valid} rows
          </Button>
        </div>
      ) : null}
      {commit.error ? (
        <Notice kind="error">
          {importIsIncomplete(commit.error) ? (
            <span data-testid="import-incomplete">{commit.error.message}</span>
          ) : (
            <>{errorText(commit.error)} Nothing was imported.</>
          )}
        </Notice>
      ) : null}
      {commit.data ? (
        <Notice kind="success">
          <span data-testid="import-result">
            Stored {rows(commit.data.imported)} in {commit.data.batches} {commit.data.batches === 1 ? 'batch' : 'batches'} of up to {commit.data.batchRows};{' '}
            {rows(commit.data.alreadyThere)} already there from an earlier import, skipped; {commit.data.flagsRaised} new flag(s) raised.
          </span>
          {commit.data.outsidePlausible
            ? ` ◇ ${commit.data.outsidePlausible} row(s) lie outside the unit’s plausible range: stored marked “outside plausible range”, with the checks computed from them withheld.`
            : ''}
        </Notice>
      ) : null}
    </section>
  );
}
