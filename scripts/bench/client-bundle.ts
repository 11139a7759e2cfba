/**
 * Client bundle sizes from the build's manifest (dist/client/.vite/manifest.json): what the
 * browser fetches for the first screen (the entry, its static imports and CSS, and the route's
 * lazy chunks), gzipped as the server sends them, and where the map code (OpenLayers) lives.
 * Sizes do not depend on the machine's load, so there is no floor; the target is the budget.
 * Target: the initial route under 400 KB gzip; ol in its own chunk, loaded by map screens only.
 * Usage: node --import tsx scripts/bench/client-bundle.ts [--build]
 */
import { spawnSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import { ROOT } from '../../tests/helpers/local-env.ts'
import { printTable } from './bench-util.ts'

const TARGET_KB = 400

interface ManifestChunk {
  file: string
  src?: string
  isEntry?: boolean
  imports?: string[]
  dynamicImports?: string[]
  css?: string[]
}

export interface BundleReport {
  routes: { name: string; files: number; raw_kB: number; gzip_kB: number }[]
  ol: { file: string; gzip_kB: number; importedBy: string[] } | null
  entryImportsOl: boolean
}

const dist = join(ROOT, 'dist', 'client')

/** Sizes of the first screens and of the ol chunk in the current build. */
export function bundleReport(): BundleReport {
  const manifest = JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8')) as Record<
    string,
    ManifestChunk
  >
  const sizes = new Map<string, { raw: number; gzip: number }>()
  const size = (file: string) => {
    let s = sizes.get(file)
    if (!s) {
      const buf = readFileSync(join(dist, file))
      s = { raw: buf.length, gzip: gzipSync(buf).length }
      sizes.set(file, s)
    }
    return s
  }
  // The files a chunk needs before it runs: itself, its static imports (recursively), their CSS.
  const closure = (keys: string[]): Set<string> => {
    const files = new Set<string>()
    const seen = new Set<string>()
    const visit = (k: string) => {
      if (seen.has(k)) return
      seen.add(k)
      const c = manifest[k]
      if (!c) throw new Error(`manifest has no ${k}`)
      files.add(c.file)
      for (const css of c.css ?? []) files.add(css)
      for (const i of c.imports ?? []) visit(i)
    }
    keys.forEach(visit)
    return files
  }
  const route = (name: string, keys: string[]) => {
    const files = closure(['index.html', ...keys])
    let raw = 0
    let gzip = 0
    for (const f of files) {
      const s = size(f)
      raw += s.raw
      gzip += s.gzip
    }
    return { name, files: files.size, raw_kB: raw / 1024, gzip_kB: gzip / 1024 }
  }
  const olKey = Object.keys(manifest).find((k) => /(^|\/)_?ol-[\w-]+\.js$/.test(k))
  const importers = olKey
    ? Object.entries(manifest)
        .filter(([, c]) => (c.imports ?? []).includes(olKey))
        .map(([k]) => k)
    : []
  return {
    routes: [
      route('sign-in (first visit)', ['src/layouts/PlainLayout.vue', 'src/pages/SignInPage.vue']),
      route('home (signed in)', ['src/layouts/MainLayout.vue', 'src/pages/HomePage.vue']),
      route('network map', [
        'src/layouts/MainLayout.vue',
        'src/pages/NetworkPage.vue',
        'src/components/network/NetworkMap.vue',
      ]),
    ],
    ol: olKey
      ? {
          file: manifest[olKey]!.file,
          gzip_kB: size(manifest[olKey]!.file).gzip / 1024,
          importedBy: importers,
        }
      : null,
    entryImportsOl: olKey ? closure(['index.html']).has(manifest[olKey]!.file) : false,
  }
}

if (process.argv[1]?.endsWith('client-bundle.ts')) {
  if (process.argv.includes('--build')) {
    const r = spawnSync('npx', ['vite', 'build'], {
      cwd: ROOT,
      stdio: ['ignore', 'ignore', 'inherit'],
    })
    if (r.status !== 0) throw new Error('vite build failed')
  }
  const r = bundleReport()
  printTable(
    `Client bundle (gzip as served; target: first screen < ${TARGET_KB} KB)`,
    ['screen', 'files', 'raw KB', 'gzip KB', 'budget used'],
    r.routes.map((x) => [
      x.name,
      x.files,
      x.raw_kB.toFixed(0),
      x.gzip_kB.toFixed(0),
      `${((x.gzip_kB / TARGET_KB) * 100).toFixed(0)}%`,
    ]),
  )
  console.log(
    r.ol
      ? `\nmap code: ${r.ol.file}, ${r.ol.gzip_kB.toFixed(0)} KB gzip, imported by ${r.ol.importedBy.join(', ')}; ` +
          (r.entryImportsOl ? 'LOADED BY THE ENTRY' : 'not loaded by the entry')
      : '\nmap code: no ol chunk in this build',
  )
}
