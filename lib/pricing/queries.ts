import 'server-only';
/**
 * Price and packaging reads. The costing reads take a workspace id (the caller has authorised
 * `prices.read`) and answer many ingredients and many dates in one statement each: "the latest
 * point on or before a day" is a lateral LIMIT 1 per (day, ingredient) over the partial index
 * ingredient_prices_as_of_index, so 3 years of daily points cost one index probe each.
 * Withdrawn points never count; of two points on the same day the later entered wins.
 */
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { CostSettings, Ingredient, IngredientPrice, PackagingItem, PackagingPrice, PackFormat, PackFormatItem, ProductVersion } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { calendarDateProblem } from '@/lib/input';
import { isoDate, todayIso } from '@/lib/format/dates';
import type { IngredientPricePoint, PackagingPricePoint, PackFormatData } from '@/lib/costing/types';
import type {
  CostSettingsView, IngredientPriceRow, PackagingItemRow, PackagingPricePointView, PackFormatView, PricePointView,
} from './schema';
import type { PackagingKind } from './vocabulary';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Ids and days that cannot match anything are dropped here, so no caller's typo becomes a database error. */
function cleanIds(ids: readonly string[]): string[] {
  return [...new Set(ids.filter((v) => UUID.test(v)))];
}
/** Before an administrator saves them: no currency, no overfill, warn above 5 %. */
const noCostSettings = (): CostSettingsView => ({ currency: null, overfillPct: 0, costWarningPct: 5 });

function cleanDays(days: readonly string[]): string[] {
  return [...new Set(days.filter((d) => calendarDateProblem(d) === null))];
}

/** The two kinds of price point differ only in their table, their subject column and what a point holds. */
const SOURCES = {
  ingredient: { table: 'ingredient_prices', subject: 'ingredient_id', columns: 'p.pack_price_minor, p.pack_size_g, p.supplier' },
  packaging: { table: 'packaging_prices', subject: 'packaging_item_id', columns: 'p.pack_price_minor, p.pieces_per_pack, p.supplier' },
} as const;
type Source = keyof typeof SOURCES;
type RawPoint = { subject_id: string; as_of?: string; valid_from: string; pack_price_minor: number; pack_size_g?: number; pieces_per_pack?: number; supplier: string | null };

async function pointsAsOf(source: Source, workspaceId: string, subjectIds: readonly string[], days: readonly string[]): Promise<RawPoint[]> {
  const ids = cleanIds(subjectIds);
  const dates = cleanDays(days);
  if (!ids.length || !dates.length || !UUID.test(workspaceId)) return [];
  const { table, subject, columns } = SOURCES[source];
  const em = await getEm();
  return em.execute<RawPoint[]>(
    `select s.id as subject_id, d.day as as_of, to_char(p.valid_from, 'YYYY-MM-DD') as valid_from, ${columns}
       from jsonb_array_elements_text(?::jsonb) as d(day)
       cross join jsonb_array_elements_text(?::jsonb) as s(id)
       cross join lateral (
         select * from "${table}" x
          where x.workspace_id = ? and x.${subject} = s.id::uuid and x.valid_from <= d.day::date and x.withdrawn_at is null
          order by x.valid_from desc, x.entered_at desc
          limit 1
       ) p`,
    [JSON.stringify(dates), JSON.stringify(ids), workspaceId],
  );
}

/**
 * The points of each subject that count from `from` to `to`: the one in force on `from` and every later
 * one up to `to`, one per day (the later entered). A lateral per subject, so its lower bound is found once
 * (one index probe) instead of once per row. `$n` placeholders name the workspace, the subject ids (a
 * jsonb array of uuids) and the two days.
 */
function pointsBetweenSql(source: Source, p: { workspace: string; ids: string; from: string; to: string }): string {
  const { table, subject, columns } = SOURCES[source];
  return `select s.id as subject_id, to_char(p.valid_from, 'YYYY-MM-DD') as valid_from, ${columns}
       from (select distinct value::uuid as id from jsonb_array_elements_text(${p.ids}::jsonb)) s
       cross join lateral (
         select distinct on (x.valid_from) x.*
           from "${table}" x
          where x.workspace_id = ${p.workspace} and x.${subject} = s.id and x.withdrawn_at is null and x.valid_from <= ${p.to}::date
            and x.valid_from >= coalesce((select y.valid_from from "${table}" y
                  where y.workspace_id = ${p.workspace} and y.${subject} = s.id and y.withdrawn_at is null and y.valid_from <= ${p.from}::date
                  order by y.valid_from desc limit 1), '1900-01-01'::date)
          order by x.valid_from, x.entered_at desc
       ) p`;
}

function rangeOf(range: { from?: string; to?: string }): { from: string; to: string } {
  return {
    from: range.from && !calendarDateProblem(range.from) ? range.from : '1900-01-01',
    to: range.to && !calendarDateProblem(range.to) ? range.to : '2200-12-31',
  };
}

async function pointsBetween(source: Source, workspaceId: string, subjectIds: readonly string[], range: { from?: string; to?: string }): Promise<RawPoint[]> {
  const ids = cleanIds(subjectIds);
  if (!ids.length || !UUID.test(workspaceId)) return [];
  const { from, to } = rangeOf(range);
  return sql<RawPoint>(
    `${pointsBetweenSql(source, { workspace: '$1', ids: '$2', from: '$3', to: '$4' })} order by s.id, p.valid_from`,
    [workspaceId, JSON.stringify(ids), from, to], `points_between_${source}`,
  );
}

/** What costing some formulas needs, read in one statement (lib/costs loadCostBasis). */
interface CostingData {
  settings: CostSettingsView;
  refuse: Map<string, number>;
  packFormats: Map<string, PackFormatData>;
  ingredientPoints: IngredientPricePoint[];
  packagingPoints: PackagingPricePoint[];
}

/**
 * The workspace's cost settings, the refuse share of each ingredient, the pack formats with their
 * packaging, and the price points of the ingredients and of the pack formats' packaging items from
 * `from` to `to` (as priceHistory / packagingPriceHistory) — one round trip instead of six.
 */
export async function costingData(
  workspaceId: string,
  need: { ingredientIds: readonly string[] | 'workspace'; packFormatIds: readonly string[] | 'workspace'; from?: string; to?: string },
): Promise<CostingData> {
  const ingredientIds = need.ingredientIds === 'workspace' ? [] : cleanIds(need.ingredientIds);
  const packFormatIds = need.packFormatIds === 'workspace' ? [] : cleanIds(need.packFormatIds);
  // 'workspace': every ingredient, and every pack format in use by name, chosen inside the same
  // statement (the formula editor's basis), so the page waits for one round trip instead of two.
  // $2 and $3 are then the empty lists an empty workspace falls back to.
  const ingredientIdsSql = need.ingredientIds === 'workspace'
    ? `(select coalesce(jsonb_agg(x.id), $2::jsonb) from (select id from ingredients where workspace_id = $1 limit 5000) x)`
    : '$2::jsonb';
  const packFormatIdsSql = need.packFormatIds === 'workspace'
    ? `(select coalesce(jsonb_agg(x.id order by x.name, x.id), $3::jsonb) from (select id, name from pack_formats where workspace_id = $1 and archived_at is null order by name, id limit 500) x)`
    : '$3::jsonb';
  const { from, to } = rangeOf(need);
  type Row = {
    settings: { currency: string; overfillPct: number; costWarningPct: number } | null;
    refuse: Array<[string, number]>;
    formats: Array<{ id: string; name: string; netFillG: number; items: Array<{ packagingItemId: string; name: string; pieces: number; perJars: number }> }>;
    ingredient_points: RawPoint[];
    packaging_points: RawPoint[];
  };
  if (!UUID.test(workspaceId)) {
    return { settings: noCostSettings(), refuse: new Map(), packFormats: new Map(), ingredientPoints: [], packagingPoints: [] };
  }
  const points = (source: Source, ids: string) =>
    `(select coalesce(json_agg(json_build_object('subject_id', p.subject_id, 'valid_from', p.valid_from, 'pack_price_minor', p.pack_price_minor,
        ${source === 'ingredient' ? `'pack_size_g', p.pack_size_g` : `'pieces_per_pack', p.pieces_per_pack`}, 'supplier', p.supplier) order by p.subject_id, p.valid_from), '[]')
       from (${pointsBetweenSql(source, { workspace: '$1', ids, from: '$4', to: '$5' })}) p)`;
  const [row] = await sql<Row>(
    `with ing_ids as (
       select ${ingredientIdsSql} as ids
     ), fmt as (
       select f.id, f.name, f.net_fill_g from pack_formats f
        where f.workspace_id = $1 and f.id in (select value::uuid from jsonb_array_elements_text(${packFormatIdsSql}))
     ), item as (
       select i.pack_format_id, i.packaging_item_id, p.name, i.pieces, i.per_jars, i.position
         from pack_format_items i join packaging_items p on p.id = i.packaging_item_id
        where i.workspace_id = $1 and i.pack_format_id in (select id from fmt)
     ), item_ids as (
       select coalesce(jsonb_agg(distinct packaging_item_id), '[]') as ids from item
     )
     select
       (select json_build_object('currency', c.currency, 'overfillPct', c.overfill_pct, 'costWarningPct', c.cost_warning_pct)
          from cost_settings c where c.workspace_id = $1) as settings,
       (select coalesce(json_agg(json_build_array(i.id, i.refuse_pct)), '[]') from ingredients i
         where i.workspace_id = $1 and i.id in (select value::uuid from jsonb_array_elements_text((select ids from ing_ids)))) as refuse,
       (select coalesce(json_agg(json_build_object('id', f.id, 'name', f.name, 'netFillG', f.net_fill_g, 'items',
          (select coalesce(json_agg(json_build_object('packagingItemId', x.packaging_item_id, 'name', x.name, 'pieces', x.pieces, 'perJars', x.per_jars) order by x.position), '[]')
             from item x where x.pack_format_id = f.id)) order by f.name, f.id), '[]') from fmt f) as formats,
       ${points('ingredient', '(select ids from ing_ids)')} as ingredient_points,
       ${points('packaging', '(select ids from item_ids)')} as packaging_points`,
    [workspaceId, JSON.stringify(ingredientIds), JSON.stringify(packFormatIds), from, to],
    // One prepared statement per text: each choice of lists is its own.
    `costing_data_${need.ingredientIds === 'workspace' ? 'all' : 'ids'}_${need.packFormatIds === 'workspace' ? 'all' : 'ids'}`,
  );
  return {
    settings: row.settings ?? noCostSettings(),
    refuse: new Map(row.refuse.map(([id, pct]) => [id, Number(pct)])),
    packFormats: new Map(row.formats.map((f) => [f.id, {
      id: f.id, name: f.name, netFillG: Number(f.netFillG),
      items: f.items.map((i) => ({ packagingItemId: i.packagingItemId, name: i.name, perJar: i.pieces / i.perJars })),
    }])),
    ingredientPoints: row.ingredient_points.map(ingredientPoint),
    packagingPoints: row.packaging_points.map(packagingPoint),
  };
}

function ingredientPoint(r: RawPoint): IngredientPricePoint {
  return { ingredientId: r.subject_id, validFrom: r.valid_from, packPriceMinor: Number(r.pack_price_minor), packSizeG: Number(r.pack_size_g), supplier: r.supplier };
}
function packagingPoint(r: RawPoint): PackagingPricePoint {
  return { packagingItemId: r.subject_id, validFrom: r.valid_from, unitPriceMinor: Number(r.pack_price_minor) / Number(r.pieces_per_pack), supplier: r.supplier };
}

function byDay<T>(rows: RawPoint[], days: readonly string[], map: (r: RawPoint) => T): Map<string, Map<string, T>> {
  const out = new Map<string, Map<string, T>>(days.map((d) => [d, new Map()]));
  for (const r of rows) out.get(r.as_of!)?.set(r.subject_id, map(r));
  return out;
}

/** The price of each ingredient in force on `date` (YYYY-MM-DD); an ingredient without one is absent (unknown). */
export async function pricesAsOf(workspaceId: string, ingredientIds: readonly string[], date: string): Promise<Map<string, IngredientPricePoint>> {
  return (await pricesAsOfDates(workspaceId, ingredientIds, [date])).get(date) ?? new Map();
}

/** Many days at once (a product's versions at their approval days and today): day → ingredient → point, in one statement. */
export async function pricesAsOfDates(workspaceId: string, ingredientIds: readonly string[], dates: readonly string[]): Promise<Map<string, Map<string, IngredientPricePoint>>> {
  return byDay(await pointsAsOf('ingredient', workspaceId, ingredientIds, dates), dates, ingredientPoint);
}

/**
 * The points that count, oldest first per ingredient: those from `from` to `to` (inclusive) and the one
 * already in force on `from`. One point per day (the later entered). Without a range: every point.
 */
export async function priceHistory(workspaceId: string, ingredientIds: readonly string[], range: { from?: string; to?: string } = {}): Promise<IngredientPricePoint[]> {
  return (await pointsBetween('ingredient', workspaceId, ingredientIds, range)).map(ingredientPoint);
}

/** The unit price of each packaging item in force on `date`; absent = unknown. */
export async function packagingPricesAsOf(workspaceId: string, packagingItemIds: readonly string[], date: string): Promise<Map<string, PackagingPricePoint>> {
  return (await packagingPricesAsOfDates(workspaceId, packagingItemIds, [date])).get(date) ?? new Map();
}

export async function packagingPricesAsOfDates(workspaceId: string, packagingItemIds: readonly string[], dates: readonly string[]): Promise<Map<string, Map<string, PackagingPricePoint>>> {
  return byDay(await pointsAsOf('packaging', workspaceId, packagingItemIds, dates), dates, packagingPoint);
}

export async function packagingPriceHistory(workspaceId: string, packagingItemIds: readonly string[], range: { from?: string; to?: string } = {}): Promise<PackagingPricePoint[]> {
  return (await pointsBetween('packaging', workspaceId, packagingItemIds, range)).map(packagingPoint);
}

/** The workspace's currency (null until chosen), filling overfill % and cost-change warning threshold %. */
export async function costSettings(workspaceId: string): Promise<CostSettingsView> {
  const em = await getEm();
  const row = await em.findOne(CostSettings, { workspace: workspaceId });
  return row ? { currency: row.currency, overfillPct: row.overfillPct, costWarningPct: row.costWarningPct } : noCostSettings();
}

/** True once any price (ingredient or packaging, withdrawn ones too) is recorded: the currency is then fixed. */
export async function workspaceHasPrices(workspaceId: string): Promise<boolean> {
  const em = await getEm();
  return (await em.count(IngredientPrice, { workspace: workspaceId })) + (await em.count(PackagingPrice, { workspace: workspaceId })) > 0;
}

/** Refuse/trim % per ingredient (0 when none is set). */
export async function refuseShares(workspaceId: string, ingredientIds: readonly string[]): Promise<Map<string, number>> {
  const ids = cleanIds(ingredientIds);
  if (!ids.length) return new Map();
  const em = await getEm();
  const rows = await em.find(Ingredient, { workspace: workspaceId, id: { $in: ids } }, { fields: ['id', 'refusePct'] });
  return new Map(rows.map((r) => [r.id, r.refusePct]));
}

/** Pack formats with their packaging, by id (archived ones too: old versions keep theirs). */
export async function packFormatsByIds(workspaceId: string, packFormatIds: readonly string[]): Promise<Map<string, PackFormatData>> {
  const ids = cleanIds(packFormatIds);
  if (!ids.length) return new Map();
  const views = await loadPackFormats(workspaceId, { id: { $in: ids } });
  return new Map(views.map((v) => [v.id, { id: v.id, name: v.name, netFillG: v.netFillG, items: v.items.map((i) => ({ packagingItemId: i.packagingItemId, name: i.name, perJar: i.pieces / i.perJars })) }]));
}

/** The pack format each formula is costed in (null: none picked). */
export async function packFormatOfFormulas(workspaceId: string, formulaIds: readonly string[]): Promise<Map<string, string | null>> {
  const ids = cleanIds(formulaIds);
  if (!ids.length) return new Map();
  const rows = await sql<{ id: string; pack_format_id: string | null }>(
    'select id, pack_format_id from formulas where workspace_id = $1 and id = any($2::uuid[])',
    [workspaceId, ids],
    'pack-format-of-formulas',
  );
  return new Map(rows.map((r) => [r.id, r.pack_format_id]));
}

/** The pack format each production version is filled in (null: none picked). */
export async function packFormatOfVersions(workspaceId: string, versionIds: readonly string[]): Promise<Map<string, string | null>> {
  const ids = cleanIds(versionIds);
  if (!ids.length) return new Map();
  const em = await getEm();
  const rows = await em.find(ProductVersion, { workspace: workspaceId, id: { $in: ids } }, { fields: ['id', 'packFormat'] });
  return new Map(rows.map((r) => [r.id, (r.packFormat as { id: string } | null)?.id ?? null]));
}

// ---- Screens and exports (the actor has prices.read) ----

function today(): string {
  return todayIso();
}

/** Every ingredient with the price in force on `asOf` (default today); archived ones only when they have prices. */
export async function ingredientPriceList(actor: Actor, asOf: string = today()): Promise<IngredientPriceRow[]> {
  const em = await getEm();
  const ingredients = await em.find(Ingredient, { ...inWorkspace(actor) }, { orderBy: { name: 'asc' }, limit: 1000 });
  const ids = ingredients.map((i) => i.id);
  const current = await pricesAsOf(actor.workspaceId, ids, asOf);
  const counts = await em.execute<{ ingredient_id: string; n: string }[]>(
    `select ingredient_id, count(*) as n from ingredient_prices where workspace_id = ? and withdrawn_at is null group by ingredient_id`, [actor.workspaceId],
  );
  const countOf = new Map(counts.map((c) => [c.ingredient_id, Number(c.n)]));
  return ingredients
    .filter((i) => !i.archivedAt || countOf.has(i.id))
    .map((i) => {
      const p = current.get(i.id);
      return {
        ingredientId: i.id, name: i.name, kind: i.kind, refusePct: i.refusePct, archived: !!i.archivedAt,
        current: p ? { validFrom: p.validFrom, packPriceMinor: p.packPriceMinor, packSizeG: p.packSizeG, supplier: p.supplier } : null,
        points: countOf.get(i.id) ?? 0,
      };
    });
}

type PointRow = {
  id: string; validFrom: string | Date; packPriceMinor: number; supplier?: string | null; enteredAt: Date;
  enteredBy: { name: string }; withdrawnAt?: Date | null; withdrawnBy?: { name: string } | null; withdrawReason?: string | null;
};
function pointView(r: PointRow): Omit<PricePointView, 'packSizeG'> {
  return {
    id: r.id,
    validFrom: isoDate(r.validFrom),
    packPriceMinor: Number(r.packPriceMinor),
    supplier: r.supplier ?? null,
    enteredAt: r.enteredAt.toISOString(),
    enteredByName: r.enteredBy.name,
    withdrawnAt: r.withdrawnAt ? r.withdrawnAt.toISOString() : null,
    withdrawnByName: r.withdrawnBy?.name ?? null,
    withdrawReason: r.withdrawReason ?? null,
  };
}

/** An ingredient's whole history for its page, withdrawn points included, newest first. */
export async function ingredientPriceDetail(actor: Actor, ingredientId: string): Promise<{ ingredient: { id: string; name: string; refusePct: number; archived: boolean }; points: PricePointView[] }> {
  const em = await getEm();
  const ingredient = await em.findOne(Ingredient, { ...inWorkspace(actor), id: ingredientId });
  if (!ingredient) throw notFound('ingredient');
  const rows = await em.find(IngredientPrice, { ...inWorkspace(actor), ingredient: ingredientId }, {
    populate: ['enteredBy', 'withdrawnBy'], orderBy: { validFrom: 'desc', enteredAt: 'desc' }, limit: 5000,
  });
  return {
    ingredient: { id: ingredient.id, name: ingredient.name, refusePct: ingredient.refusePct, archived: !!ingredient.archivedAt },
    points: rows.map((r) => ({ ...pointView(r), packSizeG: r.packSizeG })),
  };
}

export async function packagingItemList(actor: Actor, asOf: string = today()): Promise<PackagingItemRow[]> {
  const em = await getEm();
  const items = await em.find(PackagingItem, { ...inWorkspace(actor) }, { orderBy: { name: 'asc' }, limit: 1000 });
  const raw = await pointsAsOf('packaging', actor.workspaceId, items.map((i) => i.id), [asOf]);
  const current = new Map(raw.map((r) => [r.subject_id, r]));
  const counts = await em.execute<{ packaging_item_id: string; n: string }[]>(
    `select packaging_item_id, count(*) as n from packaging_prices where workspace_id = ? and withdrawn_at is null group by packaging_item_id`, [actor.workspaceId],
  );
  const countOf = new Map(counts.map((c) => [c.packaging_item_id, Number(c.n)]));
  return items.map((i) => {
    const p = current.get(i.id);
    return {
      id: i.id, name: i.name, kind: i.kind as PackagingKind, archived: !!i.archivedAt,
      current: p ? { validFrom: p.valid_from, packPriceMinor: Number(p.pack_price_minor), piecesPerPack: Number(p.pieces_per_pack), supplier: p.supplier } : null,
      points: countOf.get(i.id) ?? 0,
    };
  });
}

export async function packagingItemDetail(actor: Actor, packagingItemId: string): Promise<{ item: { id: string; name: string; kind: PackagingKind; archived: boolean }; points: PackagingPricePointView[] }> {
  const em = await getEm();
  const item = await em.findOne(PackagingItem, { ...inWorkspace(actor), id: packagingItemId });
  if (!item) throw notFound('packaging item');
  const rows = await em.find(PackagingPrice, { ...inWorkspace(actor), packagingItem: packagingItemId }, {
    populate: ['enteredBy', 'withdrawnBy'], orderBy: { validFrom: 'desc', enteredAt: 'desc' }, limit: 5000,
  });
  return {
    item: { id: item.id, name: item.name, kind: item.kind as PackagingKind, archived: !!item.archivedAt },
    points: rows.map((r) => ({ ...pointView(r), piecesPerPack: r.piecesPerPack })),
  };
}

async function loadPackFormats(workspaceId: string, where: Record<string, unknown>): Promise<PackFormatView[]> {
  const em = await getEm();
  const formats = await em.find(PackFormat, { workspace: workspaceId, ...where }, { orderBy: { name: 'asc' }, limit: 500 });
  if (!formats.length) return [];
  const items = await em.find(PackFormatItem, { workspace: workspaceId, packFormat: { $in: formats.map((f) => f.id) } }, { populate: ['packagingItem'], orderBy: { position: 'asc' } });
  return formats.map((f) => ({
    id: f.id, name: f.name, netFillG: f.netFillG, archived: !!f.archivedAt,
    items: items
      .filter((i) => (i.packFormat as { id: string }).id === f.id)
      .map((i) => {
        const item = i.packagingItem;
        return { packagingItemId: item.id, name: item.name, kind: item.kind, pieces: i.pieces, perJars: i.perJars };
      }),
  }));
}

export async function packFormatList(actor: Actor): Promise<PackFormatView[]> {
  return loadPackFormats(actor.workspaceId, {});
}

export async function getPackFormat(actor: Actor, packFormatId: string): Promise<PackFormatView> {
  const [view] = await loadPackFormats(actor.workspaceId, { id: packFormatId });
  if (!view) throw notFound('pack format');
  return view;
}
