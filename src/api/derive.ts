import {
  consistencyResultSchema,
  deriveResultSchema,
  type ConsistencyInput,
  type ConsistencyResult,
  type DeriveInput,
  type DeriveResult,
} from '@shared/schemas/derive';
import { http } from './http';

/** ΔH of a target reaction by Hess's law from the library, given reactions or both (public). */
export function deriveEnthalpy(input: DeriveInput, signal?: AbortSignal): Promise<DeriveResult> {
  return http.post('/derive', input, { schema: deriveResultSchema, ...(signal ? { signal } : {}) });
}

/** The curators' consistency fit of a group of library species to the measurements that link them. */
export function checkConsistency(input: ConsistencyInput, signal?: AbortSignal): Promise<ConsistencyResult> {
  return http.post('/library/consistency', input, { schema: consistencyResultSchema, ...(signal ? { signal } : {}) });
}
