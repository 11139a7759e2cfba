import { defineStore } from 'pinia'
import { ref } from 'vue'
import type { DocumentCheckDto, VerificationDto } from '../../shared/types/verification.ts'
import { checkPermitDocument, verifyCode } from '../api/verify.ts'

/** The public check of a permit code and, optionally, of a PDF against it. */
export const useVerifyStore = defineStore('verify', () => {
  const code = ref('')
  const result = ref<VerificationDto | null>(null)
  const documentCheck = ref<DocumentCheckDto | null>(null)
  const checking = ref(false)
  const uploading = ref(false)

  async function check(value: string): Promise<void> {
    code.value = value
    documentCheck.value = null
    checking.value = true
    try {
      result.value = await verifyCode(value)
    } finally {
      checking.value = false
    }
  }

  async function checkDocument(file: File): Promise<void> {
    uploading.value = true
    try {
      documentCheck.value = await checkPermitDocument(code.value, file)
    } finally {
      uploading.value = false
    }
  }

  return { code, result, documentCheck, checking, uploading, check, checkDocument }
})
