/**
 * The study document: one zod schema used by the client's forms, the API and the database (jsonb).
 * It is the engine's study input (SI) plus what a saved study needs around it: a schema version,
 * a label for the engine (searched in the study list), notes, and each plan's map references.
 */
import { z } from 'zod';
import { planSchema } from '../matching/input/plan';
import { studyInputSchema, type StudyInput } from '../matching/input/study';
import { fillItemIds } from './item-ids';
import { vehicleSchema, type Vehicle } from '../drive/vehicle';

/**
 * The document version. 2: losses are objects that may name the flow they were measured at
 * (`{ pressureLoss, referenceMassFlow?, referenceDensity? }`); 1 had them as plain Pa.
 */
export const STUDY_SCHEMA_VERSION = 2;

export const studyTitleSchema = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');

/** A plan as saved: the engine's plan plus a stable id and the map it is judged on. */
export const studyPlanSchema = planSchema.extend({
  /** Stable within the study, so Side by side and findings can point at a plan across edits. */
  id: z.string().min(1).max(64),
  /** A map library id (a team map or a built-in `builtin-…` one); null judges the plan without a map. */
  compressorMapId: z.string().min(1).max(80).nullable(),
  /** The turbine map of the plan's exhaust side (a team or built-in map); absent or null: none (read absent as null). */
  turbineMapId: z.string().min(1).max(80).nullable().optional(),
});
export type StudyPlan = z.output<typeof studyPlanSchema>;

const documentShape = z.strictObject({
  schemaVersion: z.literal(STUDY_SCHEMA_VERSION, { error: `schemaVersion must be ${STUDY_SCHEMA_VERSION}` }),
  /** A short description of the engine, e.g. "2.0 L four, hill-climb"; the study list searches it. */
  engineLabel: z.string().trim().max(120, 'engineLabel must be at most 120 characters'),
  notes: z.string().max(10_000, 'notes must be at most 10 000 characters'),
  engine: z.unknown(),
  fuelSystem: z.unknown(),
  power: z.unknown(),
  losses: z.unknown(),
  intercooler: z.unknown(),
  scenarios: z.unknown(),
  plans: z.array(studyPlanSchema.passthrough()).min(1, 'a study needs at least one plan').max(10, 'at most 10 plans'),
  /** The study's required margins and limits (checked by the engine's own schema); absent takes the defaults. */
  requirements: z.unknown().optional(),
  /** The car the engine drives (checked below); absent: no drive figures. */
  vehicle: z.unknown().optional(),
});

/** The engine's view of a document: plans without their ids and map references. */
export function studyInputOf(doc: {
  engine: unknown;
  fuelSystem: unknown;
  power: unknown;
  losses: unknown;
  intercooler: unknown;
  scenarios: unknown;
  plans: unknown[];
  requirements?: unknown;
}): unknown {
  return {
    engine: doc.engine,
    fuelSystem: doc.fuelSystem,
    power: doc.power,
    losses: doc.losses,
    intercooler: doc.intercooler,
    scenarios: doc.scenarios,
    plans: doc.plans.map((p) => {
      if (!p || typeof p !== 'object') return p;
      const { id: _id, compressorMapId: _map, turbineMapId: _turbine, ...plan } = p as Record<string, unknown>;
      return plan;
    }),
    // Only when given: a document without required margins stays exactly as it was.
    ...(doc.requirements !== undefined ? { requirements: doc.requirements } : {}),
  };
}

/**
 * The whole document, checked by the engine's own input schema so that a saved study always
 * computes. Issue paths are the document's paths (`plans.1.turbochargers`).
 */
export const studyDocumentSchema = documentShape
  .superRefine((doc, ctx) => {
    const plans = studyPlanSchema.array().safeParse(doc.plans);
    if (!plans.success) for (const issue of plans.error.issues) ctx.addIssue({ ...issue, path: ['plans', ...issue.path] } as never);
    const ids = new Set<string>();
    doc.plans.forEach((p, i) => {
      if (ids.has(p.id)) ctx.addIssue({ code: 'custom', path: ['plans', i, 'id'], message: 'two plans share this id' });
      ids.add(p.id);
    });
    const input = studyInputSchema.safeParse(studyInputOf(doc));
    if (!input.success) for (const issue of input.error.issues) ctx.addIssue(issue as never);
    if (doc.vehicle !== undefined) vehicleIssues(doc, ctx);
  })
  .transform((doc, ctx) => {
    // zod still runs a transform when the only issues are unrecognised keys: never throw here.
    const parsed = studyInputSchema.safeParse(studyInputOf(doc));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.addIssue(issue as never);
      return z.NEVER;
    }
    const input = parsed.data;
    const plans = doc.plans.map((p, i) => ({
      ...input.plans[i],
      id: p.id,
      compressorMapId: p.compressorMapId,
      ...(p.turbineMapId !== undefined ? { turbineMapId: p.turbineMapId } : {}),
    }));
    let vehicle = {};
    if (doc.vehicle !== undefined) {
      const v = vehicleSchema.safeParse(doc.vehicle);
      if (!v.success) return z.NEVER; // its issues were added above
      vehicle = { vehicle: v.data };
    }
    return { schemaVersion: doc.schemaVersion, engineLabel: doc.engineLabel, notes: doc.notes, ...input, plans, ...vehicle } as StudyDocument;
  });

export interface StudyDocument extends Omit<StudyInput, 'plans'> {
  schemaVersion: typeof STUDY_SCHEMA_VERSION;
  engineLabel: string;
  notes: string;
  plans: StudyPlan[];
  /** The car the engine drives; absent: no drive figures. */
  vehicle?: Vehicle;
}

/**
 * The vehicle's own checks by their document paths (`vehicle.gearRatios.2`). The scenario and plans
 * it names are not held against the rest of the document: renaming a scenario or deleting a plan in
 * the study must never block its saving. A scenario that has gone gives way to the first (the Drive
 * view says so) and a rotor of a plan that has gone is not used.
 */
function vehicleIssues(doc: z.output<typeof documentShape>, ctx: z.RefinementCtx) {
  const parsed = vehicleSchema.safeParse(doc.vehicle);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue({ ...issue, path: ['vehicle', ...issue.path] } as never);
    return;
  }
  const seen = new Set<string>();
  parsed.data.rotors?.forEach((r, i) => {
    if (seen.has(r.planId)) ctx.addIssue({ code: 'custom', path: ['vehicle', 'rotors', i, 'planId'], message: 'two rotors name this plan' });
    seen.add(r.planId);
  });
}

/** The engine input of a valid document. */
export function toStudyInput(doc: StudyDocument): StudyInput {
  return studyInputOf(doc) as StudyInput;
}

export class StudyVersionError extends Error {}

/** A version-1 loss (plain Pa) as a version-2 one: the same loss at every flow. Anything else is left for the schema to judge. */
function fixedLoss(value: unknown): unknown {
  return typeof value === 'number' ? { pressureLoss: value } : value;
}

/**
 * Brings a stored document of any earlier schema version up to the current one, one version at a
 * time. Version 0 is the pre-release shape without `schemaVersion`, `engineLabel` or `notes`,
 * whose plans named their map in `mapId` and had no ids. Version 1 gave the inlet, charge-cooler
 * and after-turbine losses as plain Pa; version 2 states each as `{ pressureLoss }`, the same loss
 * at every flow, so an old study computes exactly as before until its losses are given the flow
 * they were measured at. Scenarios and boost rows without an id get one (`fillItemIds`).
 */
export function migrateStudyDocument(raw: unknown): unknown {
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return raw;
  const doc = { ...(raw as Record<string, unknown>) };
  const version = doc.schemaVersion ?? 0;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 0) return raw;
  if (version > STUDY_SCHEMA_VERSION) {
    throw new StudyVersionError(`this study was saved by a newer Spoolbook (document version ${version}; this one reads up to ${STUDY_SCHEMA_VERSION})`);
  }
  if (version === 0) {
    doc.schemaVersion = 1;
    doc.engineLabel ??= '';
    doc.notes ??= '';
    if (Array.isArray(doc.plans)) {
      doc.plans = doc.plans.map((p, i) => {
        if (!p || typeof p !== 'object') return p;
        const { mapId, ...rest } = p as Record<string, unknown>;
        return { id: `plan-${i + 1}`, compressorMapId: typeof mapId === 'string' ? mapId : null, ...rest };
      });
    }
  }
  if (doc.schemaVersion === 1) {
    doc.schemaVersion = 2;
    if (doc.losses && typeof doc.losses === 'object' && !Array.isArray(doc.losses)) {
      const losses = doc.losses as Record<string, unknown>;
      doc.losses = { ...losses, inlet: fixedLoss(losses.inlet), chargeCooler: fixedLoss(losses.chargeCooler) };
    }
    if (Array.isArray(doc.plans)) {
      doc.plans = doc.plans.map((p) => {
        if (!p || typeof p !== 'object') return p;
        const plan = p as Record<string, unknown>;
        const exhaust = plan.exhaust;
        if (!exhaust || typeof exhaust !== 'object' || Array.isArray(exhaust)) return plan;
        const block = exhaust as Record<string, unknown>;
        return { ...plan, exhaust: { ...block, downstreamLoss: fixedLoss(block.downstreamLoss) } };
      });
    }
  }
  // Not a version step: scenario and boost row ids are optional, so any version may lack some.
  return fillItemIds(doc);
}

// ——— API shapes ———

/** What a new study can start from when no document is given: the blank study or a demo study as a template. */
export const STUDY_STARTS = {
  'demo-hillclimb': {
    title: 'The demo hill-climb study',
    description:
      'A 2.0 L four-cylinder hill-climb engine on E85 with three candidate compressors, at sea level, at altitude on a hot day, by gear and at part throttle.',
  },
  'demo-exhaust': {
    title: 'The demo exhaust-side study',
    description: 'The same engine and mid-size compressor judged on the exhaust side: two turbine housings and their wastegates.',
  },
  blank: {
    title: 'Blank',
    description: 'One plan without a map and one scenario at sea level, with neutral starting values to replace with your engine’s own.',
  },
} as const;
export type StudyStart = keyof typeof STUDY_STARTS;
export const studyStartSchema = z.enum(Object.keys(STUDY_STARTS) as [StudyStart, ...StudyStart[]], {
  error: `start must be one of ${Object.keys(STUDY_STARTS).join(', ')}`,
});

export const createStudySchema = z
  .strictObject({
    title: studyTitleSchema,
    /** A document to start from; absent starts from `start`. */
    document: z.unknown().optional(),
    /** A template to start from when no document is given; both absent start from the demo hill-climb study. */
    start: studyStartSchema.optional(),
  })
  .refine((v) => v.document === undefined || v.start === undefined, { path: ['start'], message: 'give a document or a start, not both' });
/** A copy of a study into another team the caller may write in. */
export const copyStudySchema = z.strictObject({
  /** The team the copy goes into. */
  teamId: z.string().trim().min(1, 'is required').max(64),
  /** Absent keeps the study's title. */
  title: studyTitleSchema.optional(),
});
export const saveStudySchema = z.strictObject({
  baseRevision: z.number().int().min(1),
  document: z.unknown(),
  message: z.string().trim().max(200, 'message must be at most 200 characters').optional(),
});
export const updateStudyMetaSchema = z
  .strictObject({ title: studyTitleSchema.optional(), archived: z.boolean().optional() })
  .refine((v) => v.title !== undefined || v.archived !== undefined, 'give a title or archived to change');
export const duplicateStudySchema = z.strictObject({ title: studyTitleSchema.optional() });
export const restoreRevisionSchema = z.strictObject({ baseRevision: z.number().int().min(1) });
export const createShareLinkSchema = z.strictObject({
  /** Days until the link stops working (30 when absent); null never expires (it can still be revoked). */
  expiresInDays: z.number().int().min(1).max(365).nullable().default(30),
});
export const keepShareLinkSchema = z.strictObject({ kept: z.boolean() });
export const studyListQuerySchema = z.strictObject({
  q: z.string().trim().max(100).optional(),
  author: z.string().max(64).optional(),
  archived: z.enum(['false', 'true', 'all']).default('false'),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

export const studySummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  engineLabel: z.string(),
  revision: z.number(),
  archived: z.boolean(),
  createdBy: z.string().nullable(),
  updatedBy: z.string().nullable(),
  updatedAt: z.string(),
});
export type StudySummary = z.infer<typeof studySummarySchema>;

export const studyListSchema = z.object({
  studies: z.array(studySummarySchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  authors: z.array(z.object({ id: z.string(), name: z.string() })),
});

export const studyDetailSchema = studySummarySchema.extend({
  teamId: z.string(),
  createdAt: z.string(),
  /** The saved document (already migrated to the current version). */
  document: z.unknown(),
  /** The caller may edit (owner or editor). */
  canEdit: z.boolean(),
});
export type StudyDetail = z.infer<typeof studyDetailSchema>;

export const revisionSummarySchema = z.object({
  revision: z.number(),
  message: z.string(),
  author: z.string().nullable(),
  createdAt: z.string(),
});
export const revisionDetailSchema = revisionSummarySchema.extend({ document: z.unknown() });

export const shareLinkSchema = z.object({
  id: z.string(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  expiresAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  /** An owner chose to keep it working after its maker leaves the team. */
  kept: z.boolean().optional(),
  /** Present only in the answer that created the link: the token is stored hashed and never shown again. */
  url: z.string().optional(),
});

export const sharedStudySchema = z.object({
  title: z.string(),
  revision: z.number(),
  updatedAt: z.string(),
  document: z.unknown(),
  /** The maps the plans use, by id, so the shared view computes without access to the team library. */
  maps: z.record(z.string(), z.unknown()),
});
