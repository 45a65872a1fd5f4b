import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import { type DisputeAgeKey, DISPUTE_AGE_BUCKETS, isRare, type ProgressStatus, rareThreshold } from "@/components/dashboard/rules";

export type ProgressCounts = { total: number; leased: number; counts: Record<ProgressStatus, number> };

/**
 * Items per status. "In progress" also takes unlabelled items that an annotator holds on a live lease,
 * so the six counts still add up to the total.
 */
export async function getProgressByProjectId({ projectId }: { projectId: number }): Promise<ProgressCounts> {
  const res = await db.execute<Record<ProgressStatus | "total" | "leased", number>>(sql`
    with leased as (
      select distinct item_id from assignments where project_id = ${projectId} and leased_until > now()
    )
    select
      count(*)::int as total,
      count(*) filter (where i.status = 'unlabelled' and l.item_id is null)::int as unlabelled,
      count(*) filter (where i.status = 'in_progress' or (i.status = 'unlabelled' and l.item_id is not null))::int as in_progress,
      count(*) filter (where i.status = 'agreed')::int as agreed,
      count(*) filter (where i.status = 'disputed')::int as disputed,
      count(*) filter (where i.status = 'ruled')::int as ruled,
      count(*) filter (where i.status = 'control')::int as control,
      count(l.item_id)::int as leased
    from items i left join leased l on l.item_id = i.id
    where i.project_id = ${projectId}`);
  const r = res.rows[0];
  const { total, leased, ...counts } = r;
  return { total, leased, counts };
}

export type ClassBalanceRow = {
  classId: number;
  name: string;
  colour: string;
  count: number;
  share: number | null;
  rare: boolean;
  bySource: { agreed: number; ruling: number; single: number; control: number };
};
export type ClassBalance = { finalTotal: number; threshold: number; classes: ClassBalanceRow[] };

/** Final labels per class (every class of the label set, zero included), split by where the final label came from. */
export async function getClassBalanceByProjectId({ projectId }: { projectId: number }): Promise<ClassBalance> {
  const res = await db.execute<{ id: number; name: string; colour: string; n: number; agreed: number; ruling: number; single: number; control: number }>(sql`
    with finals as (
      select final_class_id, final_source from items where project_id = ${projectId} and final_class_id is not null
    )
    select c.id, c.name, c.colour,
      count(f.final_class_id)::int as n,
      count(*) filter (where f.final_source = 'agreed')::int as agreed,
      count(*) filter (where f.final_source = 'ruling')::int as ruling,
      count(*) filter (where f.final_source = 'single')::int as single,
      count(*) filter (where f.final_source = 'control')::int as control
    from label_classes c left join finals f on f.final_class_id = c.id
    where c.project_id = ${projectId}
    group by c.id, c.name, c.colour, c.position
    order by c.position, c.id`);
  const classCount = res.rows.length;
  const finalTotal = res.rows.reduce((s, r) => s + r.n, 0);
  return {
    finalTotal,
    threshold: rareThreshold(classCount),
    classes: res.rows.map((r) => ({
      classId: r.id,
      name: r.name,
      colour: r.colour,
      count: r.n,
      share: finalTotal ? r.n / finalTotal : null,
      rare: isRare(r.n, finalTotal, classCount),
      bySource: { agreed: r.agreed, ruling: r.ruling, single: r.single, control: r.control },
    })),
  };
}

export type DailyAnnotator = { index: number; id: string | null; name: string; you: boolean; total: number };
export type DailyLabels = { timeZone: string; days: string[]; annotators: DailyAnnotator[]; cells: Array<{ day: string; annotator: number; count: number }> };

/**
 * Live labels per annotator per calendar day in `timeZone`, for the last `days` days including today.
 * Annotators are numbered 1, 2, … by user id in byte order over everyone with a live label in the
 * project, the same order the Agreement report uses, so "Annotator 3" is the same person on both screens.
 */
export async function getDailyLabelsByProjectId({ projectId, userId, days, timeZone, namesVisible }: { projectId: number; userId: string; days: number; timeZone: string; namesVisible: boolean }): Promise<DailyLabels> {
  const [dayRes, cellRes] = await Promise.all([
    db.execute<{ day: string }>(sql`
      select to_char(d, 'YYYY-MM-DD') as day
      from generate_series(date_trunc('day', now() at time zone ${timeZone}) - make_interval(days => ${days - 1}), date_trunc('day', now() at time zone ${timeZone}), interval '1 day') d
      order by d`),
    db.execute<{ idx: number; annotator_id: string; name: string | null; email: string; day: string; n: number }>(sql`
      with ann as (
        select annotator_id, row_number() over (order by annotator_id collate "C")::int as idx
        from (select distinct annotator_id from labels where project_id = ${projectId} and undone_at is null) a
      ),
      counts as (
        select l.annotator_id, to_char(l.created_at at time zone ${timeZone}, 'YYYY-MM-DD') as day, count(*)::int as n
        from labels l
        where l.project_id = ${projectId} and l.undone_at is null
          and l.created_at >= ((date_trunc('day', now() at time zone ${timeZone}) - make_interval(days => ${days - 1})) at time zone ${timeZone})
        group by 1, 2
      )
      select ann.idx, c.annotator_id, u.name, u.email, c.day, c.n
      from counts c join ann on ann.annotator_id = c.annotator_id join users u on u.id = c.annotator_id
      order by ann.idx, c.day`),
  ]);
  const byIndex = new Map<number, DailyAnnotator>();
  const cells: DailyLabels["cells"] = [];
  for (const r of cellRes.rows) {
    let a = byIndex.get(r.idx);
    if (!a) {
      const you = r.annotator_id === userId;
      const name = namesVisible ? r.name || r.email.split("@")[0] : `Annotator ${r.idx}`;
      a = { index: r.idx, id: namesVisible ? r.annotator_id : null, name, you, total: 0 };
      byIndex.set(r.idx, a);
    }
    a.total += r.n;
    cells.push({ day: r.day, annotator: r.idx, count: r.n });
  }
  return { timeZone, days: dayRes.rows.map((r) => r.day), annotators: [...byIndex.values()], cells };
}

export type SuggestionUseRow = { classId: number; shown: number; took: number; sameByKey: number; overridden: number };
export type SuggestionUse = { liveLabels: number; shownLabels: number; hiddenLabels: number; noSuggestion: number; byClass: SuggestionUseRow[] };

/**
 * What annotators did with suggestions that were on screen, by the suggested (top) class: took it
 * (Enter), chose the same class by key, or chose another class (override). Blind labels are left out.
 */
export async function getSuggestionUseByProjectId({ projectId }: { projectId: number }): Promise<SuggestionUse> {
  const [totals, rows] = await Promise.all([
    db.execute<{ live: number; shown: number; hidden: number; none: number }>(sql`
      select count(*)::int as live,
        count(*) filter (where suggestion->>'shown' = 'true')::int as shown,
        count(*) filter (where jsonb_typeof(suggestion) = 'object' and coalesce(suggestion->>'shown', 'false') <> 'true')::int as hidden,
        count(*) filter (where suggestion is null or jsonb_typeof(suggestion) <> 'object')::int as none
      from labels where project_id = ${projectId} and undone_at is null`),
    db.execute<{ top: number; shown: number; took: number; same_by_key: number; overridden: number }>(sql`
      with s as (
        select (suggestion->>'topClassId')::int as top, class_id, took_suggestion
        from labels
        where project_id = ${projectId} and undone_at is null
          and suggestion->>'shown' = 'true' and jsonb_typeof(suggestion->'topClassId') = 'number'
      )
      select top, count(*)::int as shown,
        count(*) filter (where took_suggestion)::int as took,
        count(*) filter (where not took_suggestion and class_id = top)::int as same_by_key,
        count(*) filter (where class_id <> top)::int as overridden
      from s group by top order by top`),
  ]);
  const t = totals.rows[0];
  return {
    liveLabels: t.live,
    shownLabels: t.shown,
    hiddenLabels: t.hidden,
    noSuggestion: t.none,
    byClass: rows.rows.map((r) => ({ classId: r.top, shown: r.shown, took: r.took, sameByKey: r.same_by_key, overridden: r.overridden })),
  };
}

export type DisputeAgeRow = { key: DisputeAgeKey; label: string; disagreement: number; doubt: number; total: number };
export type OpenDisputes = { open: number; oldestOpenedAt: string | null; medianAgeHours: number | null; buckets: DisputeAgeRow[] };

/** Open disputes by age (hours since opened) and reason. */
export async function getOpenDisputesByProjectId({ projectId }: { projectId: number }): Promise<OpenDisputes> {
  const bucket = sql.join(
    DISPUTE_AGE_BUCKETS.map((b) => (b.upToHours === null ? sql`else ${b.key}` : sql`when age_h < ${b.upToHours} then ${b.key}`)),
    sql` `,
  );
  const [rows, summary] = await Promise.all([
    db.execute<{ bucket: DisputeAgeKey; disagreement: number; doubt: number }>(sql`
      with d as (
        select reason, extract(epoch from (now() - opened_at)) / 3600 as age_h
        from disputes where project_id = ${projectId} and status = 'open'
      )
      select (case ${bucket} end) as bucket,
        count(*) filter (where reason = 'disagreement')::int as disagreement,
        count(*) filter (where reason = 'doubt')::int as doubt
      from d group by 1`),
    db.execute<{ open: number; oldest: Date | string | null; median_h: number | null }>(sql`
      select count(*)::int as open, min(opened_at) as oldest,
        (percentile_cont(0.5) within group (order by extract(epoch from (now() - opened_at)) / 3600))::float8 as median_h
      from disputes where project_id = ${projectId} and status = 'open'`),
  ]);
  const s = summary.rows[0];
  return {
    open: s.open,
    oldestOpenedAt: s.oldest ? new Date(s.oldest).toISOString() : null,
    medianAgeHours: s.median_h === null ? null : Number(s.median_h),
    buckets: DISPUTE_AGE_BUCKETS.map((b) => {
      const r = rows.rows.find((x) => x.bucket === b.key);
      const disagreement = r?.disagreement ?? 0;
      const doubt = r?.doubt ?? 0;
      return { key: b.key, label: b.label, disagreement, doubt, total: disagreement + doubt };
    }),
  };
}

export type DashboardData = {
  projectId: number;
  generatedAt: string;
  namesVisible: boolean;
  progress: ProgressCounts;
  balance: ClassBalance;
  daily: DailyLabels;
  suggestions: SuggestionUse;
  disputes: OpenDisputes;
};

/** Every dashboard figure but agreement, each from one aggregate query. */
export async function getDashboardByProjectId(args: { projectId: number; userId: string; days: number; timeZone: string; namesVisible: boolean }): Promise<DashboardData> {
  const { projectId } = args;
  const [progress, balance, daily, suggestions, disputes] = await Promise.all([
    getProgressByProjectId({ projectId }),
    getClassBalanceByProjectId({ projectId }),
    getDailyLabelsByProjectId(args),
    getSuggestionUseByProjectId({ projectId }),
    getOpenDisputesByProjectId({ projectId }),
  ]);
  return { projectId, generatedAt: new Date().toISOString(), namesVisible: args.namesVisible, progress, balance, daily, suggestions, disputes };
}
