import Link from 'next/link';
import type { UnitPreference } from '@/lib/chemistry';
import { buttonClass } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/Card';
import { inputClass } from '@/components/ui/Field';
import { formatDate } from '@/lib/format/dates';
import {
  EU_GROUP_LABELS,
  INGREDIENT_KINDS,
  KIND_LABELS,
  PECTIN_TYPE_LABELS,
  type IngredientOrigin,
  type IngredientView,
} from '@/lib/ingredients/schema';
import { TableBox } from '@/components/ui/TableBox';
import { completenessText } from '@/lib/ingredients/label-data';

export type IngredientSortKey = 'name' | 'kind' | 'solidsPct' | 'origin' | 'updatedAt';

export interface IngredientTableQuery {
  q?: string;
  kind?: string;
  sort?: string;
  dir?: 'asc' | 'desc';
  /** Kept in sort links so the archived filter survives a re-sort. */
  archived?: string;
}

/** The server lists by name, A → Z, when the URL names no sort. */
const DEFAULT_SORT: IngredientSortKey = 'name';
const LIBRARY_PATH = '/ingredients';
const EXPORT_PATH = '/api/v1/ingredients/export';

const SORTABLE: ReadonlySet<string> = new Set<IngredientSortKey>(['name', 'kind', 'solidsPct', 'origin', 'updatedAt']);

export const ORIGIN_LABELS: Record<IngredientOrigin, string> = {
  typical: 'Typical value',
  edited: 'Edited',
  custom: 'Own',
};

const ORIGIN_BADGES: Record<IngredientOrigin, string> = {
  typical: 'bg-damson-50 text-damson-800 ring-damson-200',
  edited: 'bg-quince-50 text-quince-700 ring-quince-200',
  custom: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
};

const ORIGIN_HINTS: Record<IngredientOrigin, string> = {
  typical: 'Handbook value shipped with Setwell.',
  edited: 'A typical value your workspace changed.',
  custom: 'Added by your workspace.',
};

const PECTIN_LEVEL_LABELS: Record<string, string> = { high: 'High pectin', medium: 'Medium pectin', low: 'Low pectin' };
const US_GROUP_LABELS: Record<string, string> = { '1': 'US Group I', '2': 'US Group II' };

/** Stored numbers without padded zeros (8, 9.2, 3.95). */
function decimal(value: number, maxDecimals = 2): string {
  return String(Number(value.toFixed(maxDecimals)));
}


function queryString(params: Record<string, string | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value) search.set(key, value);
  const s = search.toString();
  return s ? `?${s}` : '';
}

/** Matches the server: the last change lists newest first unless the URL says otherwise. */
function defaultDir(column: string): 'asc' | 'desc' {
  return column === 'updatedAt' ? 'desc' : 'asc';
}

/** The sort the server applied for this URL. */
function effectiveSort(query: IngredientTableQuery): { sort: string; dir: 'asc' | 'desc' } {
  const sort = query.sort && SORTABLE.has(query.sort) ? query.sort : DEFAULT_SORT;
  return { sort, dir: query.dir ?? defaultDir(sort) };
}

/** Next click on a header: a new column starts in its natural direction; the sorted column flips. */
export function sortHref(query: IngredientTableQuery, column: IngredientSortKey): string {
  const current = effectiveSort(query);
  const dir = current.sort === column ? (current.dir === 'asc' ? 'desc' : 'asc') : defaultDir(column);
  return `${LIBRARY_PATH}${queryString({ q: query.q?.trim() || undefined, kind: query.kind, archived: query.archived, sort: column, dir })}`;
}

function phRange(row: IngredientView): string {
  if (row.phMin != null && row.phMax != null) {
    return row.phMin === row.phMax ? decimal(row.phMin) : `${decimal(row.phMin)}–${decimal(row.phMax)}`;
  }
  if (row.phMin != null) return `from ${decimal(row.phMin)}`;
  if (row.phMax != null) return `up to ${decimal(row.phMax)}`;
  return '—';
}

function pectinText(row: IngredientView): string {
  if (row.kind === 'pectin') {
    const type = row.pectinType ? PECTIN_TYPE_LABELS[row.pectinType] : 'Type not given';
    return row.pectinGrade != null ? `${type}, grade ${decimal(row.pectinGrade, 0)}` : type;
  }
  return row.pectinLevel ? PECTIN_LEVEL_LABELS[row.pectinLevel] : '—';
}

function groupText(row: IngredientView): { eu: string | null; us: string | null } {
  return {
    eu: row.euFruitGroup ? EU_GROUP_LABELS[row.euFruitGroup] : null,
    us: row.usFruitGroup ? US_GROUP_LABELS[row.usFruitGroup] : null,
  };
}

function OriginBadge({ row }: { row: IngredientView }) {
  const label = ORIGIN_LABELS[row.origin];
  const badge = `inline-flex rounded-full px-2 py-0.5 text-xs font-semibold ring-1 ring-inset ${ORIGIN_BADGES[row.origin]}`;
  if (!row.source) {
    return (
      <span className={badge} title={ORIGIN_HINTS[row.origin]}>
        {label}
      </span>
    );
  }
  // The source sits in a <details> so it is reachable by keyboard and touch, not only on hover.
  return (
    <details className="group max-w-xs">
      <summary className={`${badge} cursor-pointer list-none`} title={`${ORIGIN_HINTS[row.origin]} Source: ${row.source}`}>
        {label}
      </summary>
      <p className="mt-1 text-xs text-rind-500">
        {row.origin === 'edited' ? 'Started from: ' : 'Source: '}
        {row.source}
      </p>
    </details>
  );
}

function LabelDataStatus({ row }: { row: IngredientView }) {
  const status = completenessText(row.labelData);
  return <span className={status.complete ? 'text-leaf-700' : 'text-quince-700'}>{status.text}</span>;
}

function SortHeader({ column, label, query }: { column: IngredientSortKey; label: string; query: IngredientTableQuery }) {
  const current = effectiveSort(query);
  const active = current.sort === column;
  const dir = current.dir;
  return (
    <th scope="col" className="px-4 py-3" aria-sort={active ? (dir === 'asc' ? 'ascending' : 'descending') : undefined}>
      <Link href={sortHref(query, column)} className="inline-flex min-h-10 items-center gap-1 hover:text-damson-800 focus-visible:outline-2 focus-visible:outline-damson-500">
        {label}
        <span aria-hidden="true">{active ? (dir === 'asc' ? '▲' : '▼') : '↕'}</span>
        <span className="sr-only">{active ? `, sorted ${dir === 'asc' ? 'ascending' : 'descending'}; activate to reverse` : ', activate to sort'}</span>
      </Link>
    </th>
  );
}

/**
 * The ingredient library. The URL holds search, filter and sort, and the server does the
 * sorting, so the table renders links and never sorts itself.
 */
export function IngredientTable({
  rows,
  query,
  canEdit,
}: {
  rows: IngredientView[];
  query: IngredientTableQuery;
  canEdit: boolean;
  /** Accepted for the page's convenience; the library holds no masses, so nothing converts. */
  massUnits?: UnitPreference;
}) {
  const searchText = query.q?.trim() ?? '';
  const kindFilter = query.kind && (INGREDIENT_KINDS as readonly string[]).includes(query.kind) ? query.kind : '';
  const filtered = searchText !== '' || kindFilter !== '';
  const kindLabel = kindFilter ? KIND_LABELS[kindFilter as keyof typeof KIND_LABELS] : '';

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <form method="get" action={LIBRARY_PATH} role="search" aria-label="Search the ingredient library" className="grid w-full gap-3 sm:w-auto sm:grid-cols-[16rem_12rem_auto] sm:items-end">
          <div>
            <label htmlFor="ingredient-search" className="mb-1 block text-sm font-medium text-rind-700">Search by name</label>
            <input id="ingredient-search" name="q" type="search" defaultValue={searchText} placeholder="e.g. quince" className={`${inputClass} min-h-10`} />
          </div>
          <div>
            <label htmlFor="ingredient-kind" className="mb-1 block text-sm font-medium text-rind-700">Kind</label>
            <select id="ingredient-kind" name="kind" defaultValue={kindFilter} className={`${inputClass} min-h-10`}>
              <option value="">All kinds</option>
              {INGREDIENT_KINDS.map((k) => (
                <option key={k} value={k}>{KIND_LABELS[k]}</option>
              ))}
            </select>
          </div>
          {query.sort && SORTABLE.has(query.sort) ? <input type="hidden" name="sort" value={query.sort} /> : null}
          {query.dir ? <input type="hidden" name="dir" value={query.dir} /> : null}
          {query.archived ? <input type="hidden" name="archived" value={query.archived} /> : null}
          <button type="submit" className={buttonClass('secondary')}>Search</button>
        </form>
        <a href={EXPORT_PATH} className={buttonClass('ghost')} download>
          Download CSV
        </a>
      </div>

      {rows.length === 0 ? (
        filtered ? (
          <EmptyState
            title={`No ingredient matches “${searchText || kindLabel}”.`}
            action={<Link href={LIBRARY_PATH} className={buttonClass('secondary')}>Clear the search</Link>}
          >
            {searchText && kindLabel ? <p>Searched within {kindLabel.toLowerCase()} only.</p> : null}
          </EmptyState>
        ) : (
          <EmptyState
            title="The ingredient library is empty."
            action={canEdit ? <Link href={`${LIBRARY_PATH}/new`} className={buttonClass('primary')}>Add your first ingredient</Link> : undefined}
          >
            {canEdit ? null : <p>Someone with edit rights can add ingredients.</p>}
          </EmptyState>
        )
      ) : (
        <TableBox label="Ingredients">
          <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm" data-testid="ingredient-table">
            <caption className="sr-only">Ingredients in this workspace&apos;s library</caption>
            <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
              <tr>
                <SortHeader column="name" label="Name" query={query} />
                <SortHeader column="kind" label="Kind" query={query} />
                <SortHeader column="solidsPct" label="Soluble solids (°Brix / %)" query={query} />
                <th scope="col" className="px-4 py-3">pH range</th>
                <th scope="col" className="px-4 py-3">Acid %</th>
                <th scope="col" className="px-4 py-3">Pectin</th>
                <th scope="col" className="px-4 py-3">EU / US group</th>
                <th scope="col" className="px-4 py-3">Label data</th>
                <SortHeader column="origin" label="Origin" query={query} />
                <SortHeader column="updatedAt" label="Last change" query={query} />
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {rows.map((row) => {
                const groups = groupText(row);
                return (
                  <tr key={row.id} className={row.archived ? 'text-rind-400' : ''} data-testid={`ingredient-row-${row.id}`}>
                    <th scope="row" className="px-4 py-3 text-left font-medium">
                      {canEdit ? (
                        <Link href={`${LIBRARY_PATH}/${row.id}`} className="inline-flex min-h-10 items-center text-damson-700 underline-offset-2 hover:underline">
                          {row.name}
                        </Link>
                      ) : (
                        row.name
                      )}
                      {row.archived ? <span className="ml-2 rounded bg-pith-200 px-1.5 py-0.5 text-xs font-normal text-rind-600">Archived</span> : null}
                    </th>
                    <td className="px-4 py-3">{KIND_LABELS[row.kind]}</td>
                    <td className="px-4 py-3 tabular-nums">{decimal(row.solidsPct)} %</td>
                    <td className="px-4 py-3 tabular-nums">{phRange(row)}</td>
                    <td className="px-4 py-3 tabular-nums">{row.acidPct != null ? `${decimal(row.acidPct)} %` : '—'}</td>
                    <td className="px-4 py-3">{pectinText(row)}</td>
                    <td className="px-4 py-3 text-xs">
                      {groups.eu || groups.us ? (
                        <>
                          {groups.eu ? <span className="block">EU: {groups.eu}</span> : null}
                          {groups.us ? <span className="block">{groups.us}</span> : null}
                        </>
                      ) : (
                        '—'
                      )}
                    </td>
                    <td className="px-4 py-3 text-xs"><LabelDataStatus row={row} /></td>
                    <td className="px-4 py-3"><OriginBadge row={row} /></td>
                    <td className="px-4 py-3 text-xs">
                      <span className="block">{row.updatedByName ?? '—'}</span>
                      <time dateTime={row.updatedAt} className="text-rind-500">{formatDate(row.updatedAt)}</time>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </TableBox>
      )}
    </div>
  );
}
