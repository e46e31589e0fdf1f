import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

const API = path.resolve(__dirname, "../../app/api");

/** Every `METHOD /api/...` that a route.ts under app/api exports. */
export function apiRoutes(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const p = path.join(dir, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name === "route.ts") {
        const src = readFileSync(p, "utf8");
        const route = "/api/" + path.relative(API, path.dirname(p)).split(path.sep).join("/");
        const methods = new Set<string>();
        for (const m of src.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) methods.add(m[1]);
        for (const m of src.matchAll(/\bas\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) methods.add(m[1]);
        for (const m of methods) out.push(`${m} ${route.replace(/\/$/, "")}`);
      }
    }
  };
  walk(API);
  return out.sort();
}
