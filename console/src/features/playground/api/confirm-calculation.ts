import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api';
import { calculationById, type CalculationId } from '../calculations';

/**
 * POST /v1/<calculation>: the server computes the same thing the preview did, with the same
 * input, so the playground can show that the two agree.
 */
export function confirmCalculation(
  id: CalculationId,
  input: unknown,
  signal?: AbortSignal,
): Promise<unknown> {
  const calculation = calculationById(id);
  if (!calculation) throw new Error(`Unknown calculation ${id}`);
  return api.post<unknown>(calculation.path, input, { signal });
}

export const calculationKeys = {
  all: ['calculation'] as const,
  confirm: (id: CalculationId, input: unknown) =>
    [...calculationKeys.all, id, 'confirm', input] as const,
};

export function confirmCalculationQueryOptions(id: CalculationId, input: unknown) {
  return queryOptions({
    queryKey: calculationKeys.confirm(id, input),
    queryFn: ({ signal }) => confirmCalculation(id, input, signal),
    staleTime: Infinity,
    retry: false,
    refetchOnWindowFocus: false,
  });
}

/** Runs only when `input` is set (the preview accepted it) and `enabled` is true. */
export function useConfirmCalculation(id: CalculationId, input: unknown, enabled = true) {
  return useQuery({
    ...confirmCalculationQueryOptions(id, input),
    enabled: enabled && input !== undefined,
  });
}
