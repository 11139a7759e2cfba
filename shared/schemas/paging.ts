import { z } from 'zod'

/** `?page=1&pageSize=50` on list endpoints; pages count from 1. */
export const pagingQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
})
export type PagingQuery = z.infer<typeof pagingQuerySchema>
