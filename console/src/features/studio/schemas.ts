import { z } from 'zod';

// The server's rule for a studio name (UpdateOrganizationRequestDto: trimmed, 1-100 characters).
export const studioNameSchema = z.object({
  name: z.string().trim().min(1, 'Give your studio a name').max(100, 'Use at most 100 characters'),
});

/** Deleting asks for the studio's exact name, as the server compares it (no trimming). */
export function deleteStudioSchema(studioName: string) {
  return z.object({
    confirmName: z.string().refine((value) => value === studioName, {
      message: 'Type the studio’s name exactly as shown',
    }),
  });
}
export type DeleteStudioValues = { confirmName: string };
