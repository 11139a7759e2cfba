import type { CreateOrganisationInput } from '../../shared/schemas/auth.ts'
import type { OrganisationDto } from '../../shared/types/user.ts'
import { http } from './http.ts'

export async function fetchOrganisations(): Promise<OrganisationDto[]> {
  const { items } = await http.get<{ items: OrganisationDto[] }>('/admin/organisations')
  return items
}

export function createOrganisation(input: CreateOrganisationInput): Promise<OrganisationDto> {
  return http.post<OrganisationDto>('/admin/organisations', input)
}
