import type { CreateUserInput, UpdateUserInput } from '../../shared/schemas/auth.ts'
import type { UserDto } from '../../shared/types/user.ts'
import { http } from './http.ts'

export async function fetchUsers(): Promise<UserDto[]> {
  const { items } = await http.get<{ items: UserDto[] }>('/admin/users')
  return items
}

export function createUser(input: CreateUserInput): Promise<UserDto> {
  return http.post<UserDto>('/admin/users', input)
}

export function updateUser(id: number, input: UpdateUserInput): Promise<UserDto> {
  return http.patch<UserDto>(`/admin/users/${id}`, input)
}
