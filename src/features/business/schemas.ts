import { businessPatchSchema } from '../../shared/contract/business';

// The settings form validates with the very schema PATCH /api/business does, every field required.
export const businessSchema = businessPatchSchema.required();
