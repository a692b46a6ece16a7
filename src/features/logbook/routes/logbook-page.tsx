import { Link, useSearchParams } from 'react-router';
import { documentKindLabels, logbookSearchSchema } from '../../../../shared/schemas/logbook';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useUnitList } from '../../../components/readings/unit-picker';
import { useCrews } from '../../../components/plant/crews';
import { usePeople } from '../../../components/people/person-select';
import { FilterSelect } from '../../../components/ui/filter-select';
import { Notice } from '../../../components/ui/notice';
import { useStationZone, useUnitZone, useZoneOfUnit } from '../../../components/station-time/use-station-zone';
import { formatStationTime } from '../../../../shared/station-time';
import { useMe } from '../../session';
import { ApiError } from '../../../lib/api-client';
import { searchParams, shiftLink, useLogbookSearch, type SearchFilters } from '../api/logbook';
import { MyReviewComments } from '../components/my-review-comments';

const FILTER_KEYS = ['q', 'unitId', 'crewId', 'personId', 'kind', 'severity', 'from', 'to', 'page'] as const;
const kindOptions = Object.entries(documentKindLabels).map(([value, label]) => ({ value, label }));
const severityOptions = [
  { value: 'alarm', label: 'Alarm' },
  { value: 'watch', label: 'Watch' },
  { value: 'high', label: 'High priority (handover)' },
];
const inputClass = 'rounded-md border border-line bg-field px-2 py-1';

/** The filters live in the address, so a search can be bookmarked, shared and reloaded. */
function useFilters(): [SearchFilters, (next: Partial<SearchFilters>) => void] {
  const [params, setParams] = useSearchParams();
  const filters: SearchFilters = { q: params.get('q') ?? '', page: Math.max(1, Number(params.get('page')) || 1) };
  for (const key of FILTER_KEYS) if (key !== 'q' && key !== 'page' && params.get(key)) filters[key] = params.get(key)!;
  const update = (next: Partial<SearchFilters>) => {
    const merged = { ...filters, page: 1, ...next };
    const out = new URLSearchParams();
    for (const key of FILTER_KEYS) if (merged[key] !== undefined && merged[key] !== '' && !(key === 'page' && merged.page === 1)) out.set(key, String(merged[key]));
    setParams(out);
  };
  return [filters, update];
}

export function LogbookPage() {
  const [filters, update] = useFilters();
  // The words are checked by the search contract before they go into the address; the other filters apply as they are chosen.
  const form = useSchemaForm(
    throughContract((v: { q: string }) => ({ q: v.q.trim() }), logbookSearchSchema),
    { defaultValues: { q: filters.q } },
  );
  const units = useUnitList();
  const crews = useCrews();
  const people = usePeople();
  const anyFilter = Boolean(filters.q || filters.unitId || filters.crewId || filters.personId || filters.kind || filters.severity || filters.from || filters.to);
  const results = useLogbookSearch(filters, anyFilter);
  const fieldErrors = results.error instanceof ApiError ? results.error.fields : {};
  const fallbackUnit = filters.unitId ? Number(filters.unitId) : (units.data?.[0]?.id ?? null);
  const pages = results.data ? Math.max(1, Math.ceil(results.data.total / results.data.pageSize)) : 1;
  // The server reads the date filters as days of the chosen unit's station, or of the first station.
  const unitZone = useUnitZone(filters.unitId ? Number(filters.unitId) : null);
  const firstZone = useStationZone(null);
  const dayZone = filters.unitId ? unitZone : firstZone;
  const zoneOf = useZoneOfUnit(useMe().data?.crewId);

  const submit = form.submit((search) => update({ q: search.q ?? '' }));
  const wordsError = form.error('q') ?? fieldErrors.q;
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Logbook history</h1>
        <p className="text-muted">Search past log entries, standing orders, handovers, flags, conditions and rounds; open any shift as it was recorded.</p>
      </div>
      <form role="search" aria-label="Search the logbook" noValidate onSubmit={submit} className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3">
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex min-w-64 flex-1 flex-col text-sm font-bold">
            Words to find
            <input className={`${inputClass} text-base font-normal`} placeholder="e.g. air ejector, waterbox backwash" aria-invalid={Boolean(wordsError)} {...form.register('q')} />
          </label>
          <Button type="submit">Search</Button>
        </div>
        <FieldMessage message={wordsError} className="text-sm font-bold text-alarm" />
        <FormFailure form={form} />
        <div className="flex flex-wrap gap-3 text-sm">
          <FilterSelect label="Unit" anyLabel="All units" value={filters.unitId} options={(units.data ?? []).map((u) => ({ value: u.id, label: u.name }))} onChange={(v) => update({ unitId: v })} />
          <FilterSelect label="Crew on shift" anyLabel="Any crew" value={filters.crewId} options={(crews.data ?? []).map((c) => ({ value: c.id, label: `Crew ${c.name}` }))} onChange={(v) => update({ crewId: v })} />
          <FilterSelect label="Person" anyLabel="Anyone" value={filters.personId} options={(people.data ?? []).map((p) => ({ value: p.id, label: p.name }))} onChange={(v) => update({ personId: v })} />
          <FilterSelect label="Record" anyLabel="Any record" value={filters.kind} options={kindOptions} onChange={(v) => update({ kind: v })} />
          <FilterSelect label="Severity" anyLabel="Any" value={filters.severity} options={severityOptions} onChange={(v) => update({ severity: v })} />
          <label className="flex flex-col">
            From (station day{dayZone ? `, ${dayZone.timeZone}` : ''})
            <input type="date" className={inputClass} value={filters.from ?? ''} onChange={(e) => update({ from: e.target.value || undefined })} />
          </label>
          <label className="flex flex-col">
            To (station day{dayZone ? `, ${dayZone.timeZone}` : ''})
            <input type="date" className={inputClass} value={filters.to ?? ''} onChange={(e) => update({ to: e.target.value || undefined })} />
            {fieldErrors.to ? <span role="alert" className="text-alarm">⚠ {fieldErrors.to}</span> : null}
          </label>
        </div>
      </form>

      {!anyFilter ? <Notice kind="info">Type some words or choose a filter to search the logbook.</Notice> : null}
      {results.error && !fieldErrors.q ? <Notice kind="error">{results.error.message}</Notice> : null}
      {results.data ? (
        <div className="flex flex-col gap-2" aria-live="polite">
          <div className="flex flex-wrap items-center gap-3">
            <p className="font-bold" data-testid="result-count">
              {results.data.total} {results.data.total === 1 ? 'record' : 'records'} found
            </p>
            {results.data.total > 0 ? (
              <a className="text-sm underline" href={`/api/logbook/search.csv?${searchParams(filters, 100)}`} download>
                Export up to 5 000 as CSV
              </a>
            ) : null}
          </div>
          <ol className="flex flex-col gap-2">
            {results.data.hits.map((hit) => {
              const link = shiftLink(hit, fallbackUnit);
              return (
                <li key={hit.documentId} className="rounded-lg border border-line bg-panel p-3" data-testid="search-hit">
                  <div className="flex flex-wrap items-baseline gap-2 text-sm">
                    <span className="rounded border border-line px-1.5 text-xs font-bold">{documentKindLabels[hit.kind as keyof typeof documentKindLabels] ?? hit.kind}</span>
                    {hit.exactPhrase ? <span className="text-xs font-bold text-accent">exact phrase</span> : null}
                    {hit.severity ? <span className="text-xs font-bold">{hit.kind === 'handover_item' ? 'priority' : 'severity'}: {hit.severity}</span> : null}
                    <span className="text-muted">
                      {zoneOf ? `${formatStationTime(hit.occurredAt, zoneOf(hit.unitId))} station time` : '…'} · {hit.unitName ?? 'whole station'}
                      {hit.crewName ? ` · crew ${hit.crewName}` : ''}
                      {hit.personName ? ` · ${hit.personName}` : ''}
                    </span>
                  </div>
                  <p className="font-bold">{hit.title}</p>
                  <p className="text-sm">{hit.snippet}</p>
                  {link ? (
                    <Link className="text-sm underline" to={link}>
                      Open the shift as it was
                    </Link>
                  ) : null}
                </li>
              );
            })}
          </ol>
          {pages > 1 ? (
            <nav aria-label="Result pages" className="flex items-center gap-3">
              <Button tone="plain" size="sm" disabled={filters.page <= 1} onClick={() => update({ page: filters.page - 1 })}>
                ← Previous
              </Button>
              <span>
                Page {filters.page} of {pages}
              </span>
              <Button tone="plain" size="sm" disabled={filters.page >= pages} onClick={() => update({ page: filters.page + 1 })}>
                Next →
              </Button>
            </nav>
          ) : null}
        </div>
      ) : null}
      <MyReviewComments />
    </section>
  );
}
