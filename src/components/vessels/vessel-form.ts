// Vessels and materials in the browser: stored in SI (mm, MPa), shown and typed in SI or US
// customary. The zod schemas check a form in the units it is shown in; the body sent to the API is
// SI. The server checks the body again (src/server/catalog.server.ts). Pure; no React.
import { z } from 'zod';
import { inToMm, mmToIn, mpaToPsi, psiToMPa, type PlanUnits } from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import { cleanFloat, type NumberValue } from '../plan/plan-draft';

export interface MaterialRow {
  id: number;
  name: string;
  elasticModulusMPa: number;
  poissonRatio: number;
  yieldStrengthMPa: number;
}
export interface VesselFeature {
  kind: 'head' | 'nozzle' | 'support' | 'thickness-change';
  axialPosition: number;
  clockDeg?: number;
  size?: number;
  name?: string;
}
export interface VesselRow {
  id: number;
  tag: string;
  name: string;
  shape: 'cylinder' | 'sphere';
  ends: 'closed' | 'open';
  insideDiameterMm: number;
  wallThicknessMm: number;
  lengthMm: number | null;
  features: unknown[];
  materialId: number | null;
  units: PlanUnits;
  material?: MaterialRow | null;
}

export const lengthUnit = (u: PlanUnits) => (u === 'US' ? 'in' : 'mm');
export const stressUnit = (u: PlanUnits) => (u === 'US' ? 'psi' : 'MPa');
/** mm → the shown unit, exact. */
export const showLength = (mm: number, u: PlanUnits) => (u === 'US' ? cleanFloat(mmToIn(mm)) : mm);
export const showStress = (mpa: number, u: PlanUnits) => (u === 'US' ? cleanFloat(mpaToPsi(mpa)) : mpa);
const toMm = (v: number, u: PlanUnits) => (u === 'US' ? cleanFloat(inToMm(v)) : v);
const toMPa = (v: number, u: PlanUnits) => (u === 'US' ? cleanFloat(psiToMPa(v)) : v);

/** A length for a table cell: `1200 mm`, `47.244 in`. */
export function formatLength(mm: number | null | undefined, u: PlanUnits): string {
  if (mm === null || mm === undefined) return '—';
  return `${formatFixed(showLength(mm, u), u === 'US' ? 3 : 1).replace(/\.0$/, '')} ${lengthUnit(u)}`;
}
/** A stress for a table cell: `200000 MPa`, `29442661 psi`. */
export function formatStress(mpa: number, u: PlanUnits): string {
  return `${formatFixed(showStress(mpa, u), u === 'US' ? 0 : 1).replace(/\.0$/, '')} ${stressUnit(u)}`;
}

const need = (what = 'a number') => ({
  error: (iss: { input?: unknown }) => (iss.input === undefined ? 'is required' : `must be ${what}`),
});
const positive = () => z.number(need()).gt(0, 'must be greater than 0');

export interface FeatureForm {
  kind: string;
  name?: string;
  axialPosition: NumberValue;
  clockDeg: NumberValue;
  size: NumberValue;
}
export interface VesselForm {
  tag: string;
  name: string;
  shape: string;
  ends: string;
  insideDiameter: NumberValue;
  wallThickness: NumberValue;
  length: NumberValue;
  materialId: string;
  features: FeatureForm[];
}

/** A vessel form, in the units it is shown in. */
export const vesselFormSchema = z
  .object({
    tag: z.string().trim().min(1, 'give the vessel a tag').max(60, 'must be at most 60 characters'),
    name: z.string().trim().min(1, 'give the vessel a name').max(160, 'must be at most 160 characters'),
    shape: z.enum(['cylinder', 'sphere'], { error: 'choose cylinder or sphere' }),
    ends: z.enum(['closed', 'open'], { error: 'choose closed or open' }),
    insideDiameter: positive(),
    wallThickness: positive(),
    length: positive().optional(),
    materialId: z.string(),
    features: z.array(
      z.object({
        kind: z.enum(['head', 'nozzle', 'support', 'thickness-change'], { error: 'choose a kind' }),
        name: z.string().optional(),
        axialPosition: z.number(need()),
        clockDeg: z.number(need()).min(0, 'must be between 0 and 360').max(360, 'must be between 0 and 360').optional(),
        size: z.number(need()).min(0, 'must not be negative').optional(),
      }),
    ),
  })
  .superRefine((v, ctx) => {
    if (v.shape === 'cylinder' && v.length === undefined)
      ctx.addIssue({ code: 'custom', path: ['length'], message: 'is required for a cylinder' });
    if (v.wallThickness >= v.insideDiameter / 2)
      ctx.addIssue({ code: 'custom', path: ['wallThickness'], message: 'must be less than the inside radius' });
  });

/** A stored vessel as a form in units `u`. */
export function vesselToForm(v: VesselRow | null, u: PlanUnits): VesselForm {
  if (!v)
    return {
      tag: '',
      name: '',
      shape: 'cylinder',
      ends: 'closed',
      insideDiameter: undefined,
      wallThickness: undefined,
      length: undefined,
      materialId: '',
      features: [],
    };
  return {
    tag: v.tag,
    name: v.name,
    shape: v.shape,
    ends: v.ends,
    insideDiameter: showLength(v.insideDiameterMm, u),
    wallThickness: showLength(v.wallThicknessMm, u),
    length: v.lengthMm === null ? undefined : showLength(v.lengthMm, u),
    materialId: v.materialId ? String(v.materialId) : '',
    features: (v.features as VesselFeature[]).map((f) => ({
      kind: f.kind,
      name: f.name,
      axialPosition: showLength(f.axialPosition, u),
      clockDeg: f.clockDeg,
      size: f.size === undefined ? undefined : showLength(f.size, u),
    })),
  };
}

/** The same form in the other units; text that is not a number stays as typed. */
export function convertVesselForm(f: VesselForm, from: PlanUnits, to: PlanUnits): VesselForm {
  if (from === to) return f;
  const len = (v: NumberValue) =>
    typeof v === 'number' ? (to === 'US' ? cleanFloat(mmToIn(v)) : cleanFloat(inToMm(v))) : v;
  return {
    ...f,
    insideDiameter: len(f.insideDiameter),
    wallThickness: len(f.wallThickness),
    length: len(f.length),
    features: f.features.map((x) => ({ ...x, axialPosition: len(x.axialPosition), size: len(x.size) })),
  };
}

export type FormIssues = Record<string, string>;
const issuesFrom = (error: z.ZodError): FormIssues => {
  const out: FormIssues = {};
  for (const i of error.issues) {
    const k = i.path.join('-');
    if (!(k in out)) out[k] = i.message;
  }
  return out;
};

/** Check a vessel form and make the API body (SI), or the problems keyed like `features-0-clockDeg`. */
export function vesselFormToBody(f: VesselForm, u: PlanUnits) {
  const r = vesselFormSchema.safeParse({
    ...f,
    features: f.features.map((x) => ({ ...x, name: x.name?.trim() || undefined })),
  });
  if (!r.success) return { ok: false as const, issues: issuesFrom(r.error) };
  const v = r.data;
  return {
    ok: true as const,
    body: {
      tag: v.tag,
      name: v.name,
      shape: v.shape,
      ends: v.ends,
      insideDiameterMm: toMm(v.insideDiameter, u),
      wallThicknessMm: toMm(v.wallThickness, u),
      lengthMm: v.shape === 'sphere' || v.length === undefined ? null : toMm(v.length, u),
      materialId: v.materialId ? Number(v.materialId) : null,
      units: u,
      features: v.features.map((x) => ({
        kind: x.kind,
        ...(x.name ? { name: x.name } : {}),
        axialPosition: toMm(x.axialPosition, u),
        ...(x.clockDeg !== undefined ? { clockDeg: x.clockDeg } : {}),
        ...(x.size !== undefined ? { size: toMm(x.size, u) } : {}),
      })),
    },
  };
}

export interface MaterialForm {
  name: string;
  elasticModulus: NumberValue;
  poissonRatio: NumberValue;
  yieldStrength: NumberValue;
}
export const materialFormSchema = (u: PlanUnits) =>
  z
    .object({
      name: z.string().trim().min(1, 'give the material a name').max(160, 'must be at most 160 characters'),
      elasticModulus: positive().refine(
        (e) => toMPa(e, u) > 500,
        u === 'US' ? 'is in psi: 29.5 Msi is 29500000' : 'is in MPa: 200 GPa is 200000',
      ),
      poissonRatio: z.number(need()).min(0, 'must be between 0 and 0.5').max(0.5, 'must be between 0 and 0.5'),
      yieldStrength: positive(),
    })
    .refine((m) => m.yieldStrength < m.elasticModulus, {
      path: ['yieldStrength'],
      message: 'must be smaller than the elastic modulus',
    });

/** Check a material form and make the API body (MPa). */
export function materialFormToBody(f: MaterialForm, u: PlanUnits) {
  const r = materialFormSchema(u).safeParse(f);
  if (!r.success) return { ok: false as const, issues: issuesFrom(r.error) };
  return {
    ok: true as const,
    body: {
      name: r.data.name,
      elasticModulusMPa: toMPa(r.data.elasticModulus, u),
      poissonRatio: r.data.poissonRatio,
      yieldStrengthMPa: toMPa(r.data.yieldStrength, u),
    },
  };
}

/** A server issue path (`lengthMm`, `features.0.size`, `elasticModulusMPa`) as the form's key (`length`, `features-0-size`). */
export function formKeyForServerPath(path: string): string {
  return path
    .split('.')
    .map((p) => p.replace(/(Mm|MPa)$/, ''))
    .join('-');
}

/** The same material form in the other units. */
export function convertMaterialForm(f: MaterialForm, from: PlanUnits, to: PlanUnits): MaterialForm {
  if (from === to) return f;
  const s = (v: NumberValue) =>
    typeof v === 'number' ? (to === 'US' ? cleanFloat(mpaToPsi(v)) : cleanFloat(psiToMPa(v))) : v;
  return { ...f, elasticModulus: s(f.elasticModulus), yieldStrength: s(f.yieldStrength) };
}
