export type ItemRow = {
  id: number;
  externalId: string;
  status: string;
  isControl: boolean;
  labelCount: number;
  finalClassId: number | null;
  priorClassId: number | null;
  poolTopClassId: number | null;
  poolTopShare: number | null;
  thumbKey: string | null;
  seq: number;
  fields: Record<string, unknown>;
};
export type ItemPage = { items: ItemRow[]; nextCursor: string | null; total: number | null };
export type ClassInfo = { id: number; name: string; colour: string };
export type Filters = { status: string; label: string; shareMin: string; shareMax: string; q: string; sort: string; dir: "asc" | "desc" };
export const emptyFilters: Filters = { status: "", label: "", shareMin: "", shareMax: "", q: "", sort: "seq", dir: "asc" };
