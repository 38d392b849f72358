import * as z from 'zod/mini';

/** A stored photo of a garment or of work in progress. The URLs are role-checked by the server. */
export const photoSchema = z.object({
  id: z.number(),
  garmentId: z.nullable(z.number()),
  kind: z.string(),
  originalName: z.nullable(z.string()),
  width: z.nullable(z.number()),
  height: z.nullable(z.number()),
  caption: z.nullable(z.string()),
  createdAt: z.string(),
  url: z.string(),
  thumbUrl: z.string(),
});
export type Photo = z.infer<typeof photoSchema>;

export const photoUploadReplySchema = z.object({ items: z.array(photoSchema) });
