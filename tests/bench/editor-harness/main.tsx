/**
 * The editor alone, for the benchmark: a generated linkage of ?n= parts, the API answered in the page
 * (every save succeeds), the same CSS as the app. Built with Vite in production mode by tests/bench/editor.ts.
 */
import "./harness.css";
import { createRoot } from "react-dom/client";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import LinkageEditor from "@/editor/LinkageEditor";
import { generateLinkage } from "@/shared/demo";
import { DEFAULT_SETTINGS } from "@/shared/analysis/types";

const n = Number(new URLSearchParams(location.search).get("n") ?? 500);
const graph = generateLinkage(n);
let revision = 1;
const realFetch = window.fetch.bind(window);
window.fetch = async (input, init) => {
  if (!String(input instanceof Request ? input.url : input).startsWith("/api/")) return realFetch(input, init);
  return new Response(JSON.stringify({ revision: ++revision, createdAt: new Date().toISOString() }), { status: 200, headers: { "content-type": "application/json" } });
};

createRoot(document.getElementById("root")!).render(
  <QueryClientProvider client={new QueryClient()}>
    <div style={{ paddingTop: "3.5rem" }}>
      <LinkageEditor
        buildId="bench"
        buildName="Bench build"
        linkageId="bench"
        linkageName={`Generated ${n}`}
        system="pitch"
        initial={{ revision: 1, graph, authorName: "Bench", createdAt: new Date().toISOString() }}
        canEdit
        canComment
        unitSystem="US"
        settings={DEFAULT_SETTINGS}
      />
    </div>
  </QueryClientProvider>,
);
