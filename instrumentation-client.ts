/**
 * Runs in the browser before the app's own code. zod checks once whether it may compile its validators
 * with `new Function`; the Content-Security-Policy (next.config.mjs: no 'unsafe-eval') refuses that, and
 * though zod catches the refusal the browser still reports a policy violation on every page. Told to
 * run without compiling, zod does not ask (tests/e2e/csp.test.ts).
 */
import { config } from "zod/v4/core";

config({ jitless: true });
