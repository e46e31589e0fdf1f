/** Request bodies of the API, one zod schema per boundary; forms on the client use the same ones. */
import { z } from "zod";
import { ROLES } from "./roles";
import { graphSchema, systemSchema } from "./linkage/schema";
import { settingsSchema } from "./analysis/types";

const text = (what: string, max: number) => z.string({ error: `${what} is required` }).trim().min(1, `${what} is required`).max(max, `${what} is at most ${max} characters`);

export const signUpInput = z.object({
  name: text("Name", 120),
  email: z.string().trim().email("Enter a valid e-mail address").max(254),
  password: z.string().min(10, "Use at least 10 characters").max(200, "At most 200 characters"),
});

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
 * A patch of a schema: every field optional and no defaults filled in, nested objects too, so that
 * a patch naming one factor leaves the stored others alone (zod's `.partial()` would fill defaults).
 */
function patchOf(schema: z.ZodObject): z.ZodObject {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, field] of Object.entries(schema.shape)) {
    let inner: z.ZodType = field instanceof z.ZodDefault ? (field.unwrap() as z.ZodType) : (field as z.ZodType);
    if (inner instanceof z.ZodObject) inner = patchOf(inner);
    shape[key] = inner.optional();
  }
  return z.object(shape);
}
type DeepPartial<T> = { [K in keyof T]?: T[K] extends object ? DeepPartial<T[K]> : T[K] };
export const settingsPatch = patchOf(settingsSchema) as unknown as z.ZodType<DeepPartial<z.infer<typeof settingsSchema>>>;

export const buildPatch = buildInput.partial().extend({ analysisSettings: settingsPatch.optional() }).refine(
  (v) => Object.keys(v).length > 0,
  "Nothing to change",
);

export const roleSchema = z.enum(ROLES, { error: "Role must be owner, builder, reviewer or viewer" });
export const memberAdd = z.object({ email: z.string().trim().email("Enter a valid e-mail address").max(254), role: roleSchema });
export const memberPatch = z.object({ role: roleSchema });
export const invitationCreate = memberAdd;

export const linkageCreate = z.object({ name: text("Linkage name", 120), system: systemSchema, graph: graphSchema.optional() });
export const linkagePatch = z
  .object({ name: text("Linkage name", 120).optional(), system: systemSchema.optional() })
  .refine((v) => v.name !== undefined || v.system !== undefined, "Nothing to change");

/** Revision numbers are Postgres integers: anything above fits no revision (and must not reach the database). */
export const REVISION_MAX = 2_147_483_647;
/** `?revision=N` and the like: a whole number from 1 to REVISION_MAX. */
export const revisionQuery = z.coerce.number().int().min(1).max(REVISION_MAX);

export const graphPut = z.object({
  baseRevision: z.number({ error: "baseRevision must be a number" }).int().min(1).max(REVISION_MAX),
  graph: graphSchema,
});

export const analyzeInput = z.object({ graph: graphSchema, settings: settingsSchema.partial().optional() });

export const mePatch = z.object({ unitSystem: z.enum(["US", "SI"]) });

export const uuidParam = z.string().uuid();

export const adminUserPatch = z.object({ isSiteAdmin: z.boolean({ error: "isSiteAdmin must be true or false" }) });
