import type { DecidedConditionInput } from '../../shared/schemas/reviews.ts'
import type { ConditionTemplateDto } from '../../shared/types/condition-templates.ts'
import type { DecidedCondition, ProposedConditionDto } from '../../shared/types/reviews.ts'

/** A condition being put together in the decision panel, before it is sent. */
export interface DraftCondition {
  key: string
  source: 'engine' | 'library' | 'own'
  code: string
  templateId?: number
  text: string
  parameters: Record<string, number | string>
  reason?: string
}

/** Fills a library text's {placeholders} with values (units follow in the text). */
export function fillTemplateText(text: string, values: Record<string, number | string>): string {
  return text.replace(/\{([a-zA-Z0-9_]+)\}/g, (whole, name: string) =>
    name in values ? String(values[name]) : whole,
  )
}

export function draftFromProposal(p: ProposedConditionDto): DraftCondition {
  return {
    key: `engine:${p.code}:${p.assessmentIds.join(',')}`,
    source: 'engine',
    code: p.code,
    text: p.text,
    parameters: {},
    reason: p.reason,
  }
}

/** A library condition with its defaults filled in, ready to edit for this application. */
export function draftFromTemplate(t: ConditionTemplateDto): DraftCondition {
  const parameters: Record<string, number | string> = {}
  for (const p of t.parameters) if (p.default !== null) parameters[p.name] = p.default
  return {
    key: `library:${t.id}`,
    source: 'library',
    code: t.code,
    templateId: t.id,
    text: t.text,
    parameters,
  }
}

/** A condition of an earlier decision, to start a new decision from it. */
export function draftFromDecided(c: DecidedCondition): DraftCondition {
  return {
    key: c.templateId ? `library:${c.templateId}` : `${c.source}:${c.code}`,
    source: c.source,
    code: c.code,
    ...(c.templateId ? { templateId: c.templateId } : {}),
    text: c.text,
    parameters: c.parameters ?? {},
    ...(c.reason ? { reason: c.reason } : {}),
  }
}

/** Adds a draft unless one with the same key is there already. */
export function addDraft(list: DraftCondition[], item: DraftCondition): DraftCondition[] {
  return list.some((c) => c.key === item.key) ? list : [...list, item]
}

/**
 * The conditions as the decision schema wants them: library ones by template and parameters
 * (the server fills the text), the others with their edited text.
 */
export function toDecidedInputs(list: DraftCondition[]): DecidedConditionInput[] {
  return list.map((c) => {
    if (c.source === 'library' && c.templateId !== undefined) {
      return { source: 'library', code: c.code, templateId: c.templateId, parameters: c.parameters }
    }
    return {
      source: c.source,
      code: c.code,
      text: c.text.trim(),
      ...(c.reason ? { reason: c.reason } : {}),
    }
  })
}
