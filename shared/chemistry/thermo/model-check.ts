import { BOUNDARY_TOLERANCE } from './constants';
import { ThermoModelError, type FieldPath, type ThermoModelIssue } from './errors';
import type { HeatCapacityModel, SpeciesThermoModel } from './types';

const COEFFICIENT_COUNT = { nasa7: 7, nasa9: 9, shomate: 8 } as const;

/** Model kinds whose H and S carry absolute levels, so they may sit on the formation scale. */
export const FORMATION_SCALE_KINDS: readonly HeatCapacityModel['kind'][] = ['nasa7', 'nasa9', 'shomate'];

const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Lowest and highest temperature (K) of one heat-capacity model as stated. */
export function modelBounds(model: HeatCapacityModel): [number, number] {
  switch (model.kind) {
    case 'nasa7':
    case 'nasa9':
    case 'shomate':
      return [model.ranges[0]!, model.ranges[model.ranges.length - 1]!];
    case 'cp-table':
      return [model.points[0]![0], model.points[model.points.length - 1]![0]];
    case 'constant':
      return [model.range[0], model.range[1]];
  }
}

function increasing(values: readonly unknown[], path: FieldPath, issues: ThermoModelIssue[], what: string): void {
  values.forEach((v, i) => {
    if (!isFiniteNumber(v) || v <= 0)
      issues.push({ path: [...path, i], message: `${what} must be a finite temperature above 0 K` });
    else if (i > 0 && isFiniteNumber(values[i - 1]) && v <= (values[i - 1] as number))
      issues.push({
        path: [...path, i],
        message: `${what} must increase strictly (${v} K follows ${values[i - 1] as number} K)`,
      });
  });
}

function heatCapacityModelIssues(model: HeatCapacityModel, path: FieldPath): ThermoModelIssue[] {
  const issues: ThermoModelIssue[] = [];
  if (typeof model !== 'object' || model === null) return [{ path, message: 'model must be an object' }];
  switch (model.kind) {
    case 'nasa7':
    case 'nasa9':
    case 'shomate': {
      const count = COEFFICIENT_COUNT[model.kind];
      if (!Array.isArray(model.ranges) || model.ranges.length < 2) {
        issues.push({ path: [...path, 'ranges'], message: 'ranges must list at least two temperatures' });
        break;
      }
      increasing(model.ranges, [...path, 'ranges'], issues, 'a range boundary');
      if (!Array.isArray(model.coefficients) || model.coefficients.length !== model.ranges.length - 1) {
        issues.push({
          path: [...path, 'coefficients'],
          message: `coefficients must hold one array per range (${model.ranges.length - 1})`,
        });
        break;
      }
      model.coefficients.forEach((row, i) => {
        if (!Array.isArray(row) || row.length !== count || !row.every(isFiniteNumber))
          issues.push({
            path: [...path, 'coefficients', i],
            message: `a ${model.kind} range needs exactly ${count} finite coefficients`,
          });
      });
      break;
    }
    case 'cp-table': {
      if (!Array.isArray(model.points) || model.points.length < 2) {
        issues.push({ path: [...path, 'points'], message: 'a Cp table needs at least two points' });
        break;
      }
      const temperatures = model.points.map((p) => (Array.isArray(p) ? p[0] : undefined));
      model.points.forEach((p, i) => {
        if (!Array.isArray(p) || p.length !== 2)
          issues.push({ path: [...path, 'points', i], message: 'a point is [T in K, Cp in J/(mol K)]' });
        // No sign rule: partial molar Cp° of aqueous ions on the H⁺ convention is often negative.
        else if (!isFiniteNumber(p[1]))
          issues.push({ path: [...path, 'points', i, 1], message: 'Cp must be a finite value in J/(mol K)' });
      });
      increasing(temperatures, [...path, 'points'], issues, 'a table temperature');
      break;
    }
    case 'constant': {
      // No sign rule: partial molar Cp° of aqueous ions (Cl⁻(aq) about −136 J/(mol K)) can be negative.
      if (!isFiniteNumber(model.cp))
        issues.push({ path: [...path, 'cp'], message: 'cp must be a finite value in J/(mol K)' });
      if (!Array.isArray(model.range) || model.range.length !== 2)
        issues.push({ path: [...path, 'range'], message: 'range is [Tmin, Tmax] in K' });
      else increasing(model.range, [...path, 'range'], issues, 'a range boundary');
      break;
    }
    default:
      issues.push({
        path: [...path, 'kind'],
        message: `unknown model kind '${String((model as { kind?: unknown }).kind)}'`,
      });
  }
  return issues;
}

/**
 * Every rule of seeds/library/FORMAT.md a species model breaks, each with its path inside the
 * model (`['forms', 1, 'model', 'coefficients', 0]`). Empty when the model is valid. The zod
 * schema of shared/schemas/thermo.ts applies the same rules.
 */
export function thermoModelIssues(model: SpeciesThermoModel): ThermoModelIssue[] {
  if (typeof model !== 'object' || model === null)
    return [{ path: [], message: 'a model is an object with species, scale and forms' }];
  const issues: ThermoModelIssue[] = [];
  if (typeof model.species !== 'string' || model.species.trim() === '')
    issues.push({ path: ['species'], message: 'species must name the species' });
  if (model.scale !== 'formation' && model.scale !== 'relative')
    issues.push({ path: ['scale'], message: "scale must be 'formation' or 'relative'" });
  if (!Array.isArray(model.forms) || model.forms.length === 0) {
    issues.push({ path: ['forms'], message: 'a model needs at least one form' });
    return issues;
  }
  let previousMax: number | null = null;
  model.forms.forEach((form, i) => {
    const path: FieldPath = ['forms', i];
    if (typeof form !== 'object' || form === null) {
      issues.push({ path, message: 'a form is an object with form, label and model' });
      previousMax = null;
      return;
    }
    const modelIssues = heatCapacityModelIssues(form.model, [...path, 'model']);
    issues.push(...modelIssues);
    const bounds = modelIssues.length === 0 ? modelBounds(form.model) : null;
    if (bounds && previousMax !== null && Math.abs(bounds[0] - previousMax) > BOUNDARY_TOLERANCE)
      issues.push({
        path: [...path, 'model'],
        message: `form starts at ${bounds[0]} K but the form before it ends at ${previousMax} K`,
      });
    if (model.scale === 'formation') {
      if (!FORMATION_SCALE_KINDS.includes(form.model?.kind))
        issues.push({
          path: [...path, 'model', 'kind'],
          message: `a ${String(form.model?.kind)} model has no absolute H level, so it cannot be on the formation scale`,
        });
      if (form.transition !== undefined)
        issues.push({
          path: [...path, 'transition'],
          message: 'on the formation scale the transition enthalpy is the jump of H between forms, not a stated value',
        });
    } else if (model.scale === 'relative') {
      if (i === 0 && form.transition !== undefined)
        issues.push({ path: [...path, 'transition'], message: 'the first form has no transition into it' });
      if (i > 0) {
        const t = form.transition;
        if (!t)
          issues.push({
            path: [...path, 'transition'],
            message: 'every form after the first states its transition (temperature, enthalpy)',
          });
        else {
          if (!isFiniteNumber(t.enthalpy))
            issues.push({
              path: [...path, 'transition', 'enthalpy'],
              message: 'transition enthalpy must be a finite value in kJ/mol',
            });
          if (!isFiniteNumber(t.temperature) || (bounds && Math.abs(t.temperature - bounds[0]) > BOUNDARY_TOLERANCE))
            issues.push({
              path: [...path, 'transition', 'temperature'],
              message: 'transition temperature must equal the boundary the two forms share',
            });
        }
      }
    }
    if (typeof form.label !== 'string')
      issues.push({ path: [...path, 'label'], message: "label must be the source's label" });
    if (form.form !== null && typeof form.form !== 'string')
      issues.push({ path: [...path, 'form'], message: 'form must be a short label or null' });
    previousMax = bounds ? bounds[1] : null;
  });
  return issues;
}

/** Throws `ThermoModelError` listing every problem when the model is not valid. */
export function assertThermoModel(model: SpeciesThermoModel): void {
  const issues = thermoModelIssues(model);
  if (issues.length > 0)
    throw new ThermoModelError(typeof model.species === 'string' ? model.species : 'the species', issues);
}
