import { defineStore } from 'pinia'
import { ref } from 'vue'
import * as organisationsApi from '../api/organisations.ts'
import type { CreateOrganisationInput } from '../../shared/schemas/auth.ts'
import type { OrganisationDto } from '../../shared/types/user.ts'

/** Organisations, as the administrator manages them. */
export const useOrganisationsStore = defineStore('organisations', () => {
  const items = ref<OrganisationDto[]>([])
  const loading = ref(false)

  async function loadOrganisations(): Promise<void> {
    loading.value = true
    try {
      items.value = await organisationsApi.fetchOrganisations()
    } finally {
      loading.value = false
    }
  }

  async function createOrganisation(input: CreateOrganisationInput): Promise<OrganisationDto> {
    const created = await organisationsApi.createOrganisation(input)
    items.value = [...items.value, created].sort((a, b) => a.name.localeCompare(b.name))
    return created
  }

  return { items, loading, loadOrganisations, createOrganisation }
})
