// The engine thread's entry: TypeScript through tsx (a dependency, as for the export worker), then lib/engine/thread.ts.
require("tsx/cjs/api").register();
require("./thread.ts");
