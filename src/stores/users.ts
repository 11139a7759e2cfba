import { defineStore } from 'pinia'
import { ref } from 'vue'
import * as usersApi from '../api/users.ts'
import type { CreateUserInput, UpdateUserInput } from '../../shared/schemas/auth.ts'
import type { UserDto } from '../../shared/types/user.ts'

/** User accounts, as the administrator manages them. */
export const useUsersStore = defineStore('users', () => {
  const items = ref<UserDto[]>([])
  const loading = ref(false)

  async function loadUsers(): Promise<void> {
    loading.value = true
    try {
      items.value = await usersApi.fetchUsers()
    } finally {
      loading.value = false
    }
  }

  async function createUser(input: CreateUserInput): Promise<UserDto> {
    const created = await usersApi.createUser(input)
    items.value = [...items.value, created]
    return created
  }

  async function updateUser(id: number, input: UpdateUserInput): Promise<UserDto> {
    const updated = await usersApi.updateUser(id, input)
    items.value = items.value.map((user) => (user.id === id ? updated : user))
    return updated
  }

  return { items, loading, loadUsers, createUser, updateUser }
})
