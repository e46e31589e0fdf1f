import type { Client } from "../../support/http";

export type Who = "owner" | "builder" | "reviewer" | "viewer" | "outsider" | "anon";
export const WHO: Who[] = ["owner", "builder", "reviewer", "viewer", "outsider", "anon"];
export type Member = { id: string; email: string };
/** A fresh build per case: its ids, the members' users, and whatever the row's `prepare` added. */
export type Ctx = {
  buildId: string; linkageId: string; invitationId: string; extraId: string; token: string;
  users: Record<Exclude<Who, "anon">, Member>;
  x: Record<string, string>;
};
export type Row = {
  expect: Record<Who, number>;
  path: (c: Ctx) => string;
  body?: (c: Ctx) => unknown;
  /** Extra fixtures for this row (ids land in ctx.x). */
  prepare?: (c: Ctx) => Promise<Record<string, string>>;
  /** A request that is not JSON (uploads): replaces the default request. */
  send?: (client: Client, c: Ctx) => Promise<{ status: number; body: any }>;
};
/** Malformed bodies for a write route, each with a field the 400 must name. */
export type BadInput = Record<string, { path: (c: Ctx) => string; bodies: [unknown, string][]; /** Who sends them (default: the owner). */ as?: "owner" | "reviewer" }>;

export const read = { owner: 200, builder: 200, reviewer: 200, viewer: 200, outsider: 404, anon: 401 };
export const edit = (ok: number) => ({ owner: ok, builder: ok, reviewer: 403, viewer: 403, outsider: 404, anon: 401 });
export const manage = (ok: number) => ({ owner: ok, builder: 403, reviewer: 403, viewer: 403, outsider: 404, anon: 401 });
export const comment = (ok: number) => ({ owner: ok, builder: ok, reviewer: ok, viewer: 403, outsider: 404, anon: 401 });
export const signedIn = (ok: number) => ({ owner: ok, builder: ok, reviewer: ok, viewer: ok, outsider: ok, anon: 401 });
export const anyone = (ok: number) => ({ owner: ok, builder: ok, reviewer: ok, viewer: ok, outsider: ok, anon: ok });
