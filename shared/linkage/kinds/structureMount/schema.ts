import { z } from "zod";

/** The props of a structureMount part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({ note: z.string().max(200).default("") });
export type Props = z.output<typeof props>;
