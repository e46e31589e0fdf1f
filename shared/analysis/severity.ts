/** How serious a finding is, most serious first (without the schema library, for the editor's first load). */
export const SEVERITIES = ["hazard", "caution", "advisory"] as const;
export type Severity = (typeof SEVERITIES)[number];
