// The body of a signature (POST …/review and …/release, DESIGN 5).
import { z } from 'zod';

export const signatureBody = z.object({
  reductionId: z.number().int().positive('is the reduction you reviewed (its id)'),
  password: z.string().min(1, 'is required: signing asks for your password again').max(1024),
  statement: z.string().trim().max(2000, 'at most 2000 characters').optional(),
});
