import { useMutation } from '@tanstack/react-query';
import type { CreatePotInput, Pot, UpdatePotInput } from '@shared/schemas/pots';
import { api } from '@/lib/api-client';
import { useRefreshPots } from './refresh-pots';

/** Every field a grower can set, as stored now. */
export function potInput(pot: Pot): CreatePotInput {
  return {
    label: pot.label,
    capacityL: pot.capacityL,
    heightCm: pot.heightCm,
    widestDiameterCm: pot.widestDiameterCm,
    neckDiameterCm: pot.neckDiameterCm,
    shape: pot.shape,
    clayBody: pot.clayBody,
    make: pot.make,
    firingCone: pot.firingCone,
    installedOn: pot.installedOn,
    plotId: pot.plotId,
    condition: pot.condition,
    notes: pot.notes,
  };
}

/**
 * PATCH /api/pots/:id. The request always carries the whole pot with the changes on top:
 * updatePotInputSchema is `.partial()` of a schema with defaults, and zod 4 fills those
 * defaults for absent keys, so a body of only `{ condition }` would also reset the plot,
 * cone, notes and sizes on the server.
 */
export const updatePot = (pot: Pot, changes: UpdatePotInput) => api.patch<Pot>(`/api/pots/${pot.id}`, { ...potInput(pot), ...changes });

export function useUpdatePot() {
  const refresh = useRefreshPots();
  return useMutation({
    mutationFn: ({ pot, changes }: { pot: Pot; changes: UpdatePotInput }) => updatePot(pot, changes),
    onSuccess: (updated, { pot }) => refresh([pot.trialId, updated.trialId]),
  });
}
