import { defineStore } from 'pinia'
import { ref } from 'vue'
import type {
  ConditionTemplateInput,
  ConditionTemplateUpdate,
} from '../../shared/schemas/condition-templates.ts'
import type { ConditionTemplateDto } from '../../shared/types/condition-templates.ts'
import {
  createConditionTemplate,
  fetchConditionTemplates,
  retireConditionTemplate,
  updateConditionTemplate,
} from '../api/condition-templates.ts'

/** The owner's own library of standard conditions. */
export const useConditionLibraryStore = defineStore('condition-library', () => {
  const items = ref<ConditionTemplateDto[]>([])
  const loading = ref(false)
  const saving = ref(false)

  async function load(): Promise<void> {
    loading.value = true
    try {
      items.value = await fetchConditionTemplates(true)
    } finally {
      loading.value = false
    }
  }

  async function save(
    id: number | null,
    input: ConditionTemplateInput | ConditionTemplateUpdate,
  ): Promise<void> {
    saving.value = true
    try {
      const saved =
        id === null
          ? await createConditionTemplate(input)
          : await updateConditionTemplate(id, input as ConditionTemplateUpdate)
      items.value = [...items.value.filter((t) => t.id !== saved.id), saved].sort((a, b) =>
        a.code.localeCompare(b.code),
      )
    } finally {
      saving.value = false
    }
  }

  async function retire(id: number): Promise<void> {
    await retireConditionTemplate(id)
    await load()
  }

  return { items, loading, saving, load, save, retire }
})
