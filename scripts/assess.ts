/**
 * Engine CLI: reads one assessment input (JSON, issue 3 contract) on stdin, validates it with the
 * same schema as the API, runs the statics engine and prints the result as JSON on stdout.
 * Exit codes: 0 success; 2 invalid JSON or invalid input (one line per field on stderr, no stack
 * trace); 1 unexpected internal error. Run it through the `scripts/assess` wrapper.
 */
import { assessmentInputSchema, formatZodIssues } from '../shared/schemas/assessment-input.ts'
import { assessPipe } from '../shared/statics/index.ts'

const EXIT_INVALID_INPUT = 2
const EXIT_INTERNAL = 1

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = []
  for await (const chunk of process.stdin)
    chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : chunk)
  return Buffer.concat(chunks).toString('utf8')
}

function fail(lines: string[], code: number): never {
  process.stderr.write(`${lines.join('\n')}\n`)
  process.exit(code)
}

async function main(): Promise<void> {
  if (process.argv.includes('--help') || process.argv.includes('-h')) {
    process.stdout.write('Usage: scripts/assess < input.json > result.json\n')
    return
  }
  const text = await readStdin()
  let json: unknown
  try {
    json = JSON.parse(text)
  } catch (error) {
    fail(
      [`input: not valid JSON (${error instanceof Error ? error.message : String(error)})`],
      EXIT_INVALID_INPUT,
    )
  }
  const parsed = assessmentInputSchema.safeParse(json)
  if (!parsed.success) {
    fail(
      formatZodIssues(parsed.error).map((issue) => `${issue.field}: ${issue.message}`),
      EXIT_INVALID_INPUT,
    )
  }
  let result
  try {
    result = assessPipe(parsed.data)
  } catch (error) {
    // The engine names the field in its RangeErrors (e.g. "pipe.allowableStress_MPa is required ...").
    if (error instanceof RangeError) fail([error.message], EXIT_INVALID_INPUT)
    fail(
      [`internal error: ${error instanceof Error ? error.message : String(error)}`],
      EXIT_INTERNAL,
    )
  }
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`)
}

await main()
