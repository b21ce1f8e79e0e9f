import {
  derivedValueListSchema,
  derivedValueSchema,
  type DerivedValue,
  type DerivedValueInput,
} from '@shared/schemas/derived-values';
import { http } from './http';

const valuesPath = (teamId: string) => `/teams/${encodeURIComponent(teamId)}/derived-values`;

/** A team's derived ΔfH° values, newest first (viewers may read). */
export async function listDerivedValues(teamId: string): Promise<DerivedValue[]> {
  return (await http.get(valuesPath(teamId), { schema: derivedValueListSchema })).items;
}

/** Saves a derived ΔfH° as the team's value; the server runs the derivation again (members). */
export function saveDerivedValue(teamId: string, input: DerivedValueInput): Promise<DerivedValue> {
  return http.post(valuesPath(teamId), input, { schema: derivedValueSchema });
}

/** Deletes one of the team's derived values (members). */
export function deleteDerivedValue(teamId: string, valueId: string): Promise<void> {
  return http.delete(`${valuesPath(teamId)}/${encodeURIComponent(valueId)}`);
}
