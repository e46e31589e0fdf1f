/** The builds resource: create, patch (name, model, registration, design settings), and what the API answers. */
import { z } from "zod";
import { ROLES } from "../roles";
import { settingsSchema } from "../analysis/types";
import { isoTime, patchWithSomething, text } from "./common";

export const buildInput = z.object({
  name: text("Build name", 120),
  model: z.string().trim().max(120, "Model is at most 120 characters").default(""),
  registration: z
    .string()
    .trim()
    .max(20, "Registration is at most 20 characters")
    .regex(/^[A-Za-z0-9-]*$/, "Letters, digits and dashes only")
    .optional()
    .nullable(),
});

/**
 * Any of the build's fields, design settings named one by one: what the patch leaves out keeps its
 * stored value (no defaults filled in).
 */
export const buildPatch = patchWithSomething(buildInput.extend({ analysisSettings: settingsSchema }));

export const build = z.object({
  id: z.string(),
  name: z.string(),
  model: z.string(),
  registration: z.string().nullable(),
  /** As stored; `settingsSchema.parse` fills what an older build lacks. */
  analysisSettings: z.record(z.string(), z.unknown()),
  createdAt: isoTime,
  updatedAt: isoTime,
});
export type Build = z.infer<typeof build>;
/** A build in the signed-in user's list. */
export const buildListItem = build.extend({ role: z.enum(ROLES), linkageCount: z.number().int(), memberCount: z.number().int() });
export type BuildListItem = z.infer<typeof buildListItem>;

export const buildsResponse = z.object({ builds: z.array(buildListItem) });
export const buildResponse = z.object({ build, role: z.enum(ROLES) });
