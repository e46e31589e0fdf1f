import { describe, expect, it } from "vitest";
import { isDatabaseUnavailable, stampUnavailable } from "@/db/unavailable";
import { DB_UNAVAILABLE_DIGEST } from "@/shared/unavailable";

const err = (props: Record<string, unknown>, message = "boom") => Object.assign(new Error(message), props);

describe("telling a database that is not answering from other errors", () => {
  it("stamps connection failures raised by the pool or a query", () => {
    for (const e of [
      err({ code: "ECONNREFUSED" }, "connect ECONNREFUSED 127.0.0.1:5432"),
      err({ code: "57P01" }, "terminating connection due to administrator command"),
      err({ code: "57P03" }, "the database system is starting up"),
      err({ name: "KnexTimeoutError" }, "Knex: Timeout acquiring a connection. The pool is probably full."),
      err({}, "select 1 - Connection terminated unexpectedly"),
      Object.assign(new AggregateError([err({ code: "ECONNREFUSED" }), err({ code: "ECONNREFUSED" })]), {}),
    ]) {
      expect(isDatabaseUnavailable(stampUnavailable(e)), String(e)).toBe(true);
      expect((e as { digest?: string }).digest).toBe(DB_UNAVAILABLE_DIGEST);
    }
  });

  it("leaves the request's own faults alone", () => {
    for (const e of [err({ code: "23505" }, "duplicate key"), err({ code: "22P02" }, "invalid input syntax"), new TypeError("x is undefined"), err({}, "Connection refused by policy")]) {
      expect(isDatabaseUnavailable(stampUnavailable(e)), String(e)).toBe(false);
    }
  });

  it("does not count a refused socket that the database's pool did not stamp (storage, mail)", () => {
    expect(isDatabaseUnavailable(err({ code: "ECONNREFUSED" }))).toBe(false);
    expect(isDatabaseUnavailable(err({ code: "57P01" }))).toBe(true); // PostgreSQL's own code, wherever it came from
  });
});
