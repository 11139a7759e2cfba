import { ErrorCode } from '../../shared/errors.ts'
import { config } from '../config.ts'
import { ApiError } from './api-error.ts'
import { CLIENT_HEADER, toApiError } from './http.ts'

/** An upload in progress: its result and a way to cancel it. */
export interface UploadHandle<T> {
  promise: Promise<T>
  abort: () => void
}

/**
 * Upload one file as multipart (field `file`, plus text `fields`) to an API path. Uses
 * XMLHttpRequest, because fetch reports no upload progress; the CSRF header and the error
 * mapping are those of http.ts. `onProgress` gets the fraction sent, 0 to 1.
 */
export function uploadMultipart<T>(
  path: string,
  file: File,
  fields: Record<string, string>,
  onProgress: (fraction: number) => void,
): UploadHandle<T> {
  const xhr = new XMLHttpRequest()
  const promise = new Promise<T>((resolve, reject) => {
    const body = new FormData()
    // Fields before the file, so the server has them when the file stream starts.
    for (const [k, v] of Object.entries(fields)) body.append(k, v)
    body.append('file', file, file.name)
    xhr.open('POST', `${config.apiBase}${path}`)
    xhr.setRequestHeader(CLIENT_HEADER, '1')
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.withCredentials = true
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total)
    }
    xhr.onload = () => {
      let parsed: unknown
      try {
        parsed = xhr.responseText ? (JSON.parse(xhr.responseText) as unknown) : undefined
      } catch {
        parsed = undefined
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1)
        resolve(parsed as T)
      } else reject(toApiError(xhr.status, parsed, xhr.statusText))
    }
    xhr.onerror = () =>
      reject(
        new ApiError(
          0,
          ErrorCode.NETWORK,
          'The upload was cut off. Check your connection and try again.',
        ),
      )
    xhr.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'))
    xhr.send(body)
  })
  return { promise, abort: () => xhr.abort() }
}
