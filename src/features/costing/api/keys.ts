import { useMutation, useQueryClient } from '@tanstack/react-query';

/**
 * Every costing query key starts with this. A change to one ingredient, pack,
 * preparation, size or policy moves the cost of drinks, preparations, the menu
 * and their cards alike, so every costing write invalidates the whole family.
 */
export const costingKey = ['costing'] as const;

/** A costing write that refreshes every costing query once it succeeds. */
export function useCostingMutation<TIn, TOut>(mutationFn: (input: TIn) => Promise<TOut>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: costingKey }),
  });
}
