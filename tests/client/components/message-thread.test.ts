import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import { Quasar } from 'quasar'
import type { ReviewMessageDto } from '../../../shared/types/reviews.ts'
import MessageThread from '../../../src/components/reviews/MessageThread.vue'

const messages: ReviewMessageDto[] = [
  {
    id: 1,
    kind: 'question',
    body: 'Please send the lift plan.',
    author: { id: 7, name: 'Gas engineer' },
    attachments: [],
    createdAt: '2026-12-01T09:00:00.000Z',
  },
  {
    id: 2,
    kind: 'answer',
    body: 'Attached.',
    author: { id: 8, name: 'Site manager' },
    attachments: [{ id: 41, applicationId: 5, kind: 'lift_plan', filename: 'lift-plan.pdf' }],
    createdAt: '2026-12-01T10:00:00.000Z',
  },
]

describe('MessageThread', () => {
  it('links each document sent with an answer to its download by id', () => {
    const wrapper = mount(MessageThread, {
      props: { messages },
      global: { plugins: [Quasar] },
    })
    const links = wrapper.find('[data-testid="message-documents-2"]').findAll('a')
    expect(links.map((a) => a.text())).toEqual(['lift-plan.pdf'])
    expect(links[0]!.attributes('href')).toBe('/api/applications/5/attachments/41/file')
    expect(wrapper.find('[data-testid="message-documents-1"]').exists()).toBe(false)
  })

  it('sends the answer text with no documents when none are chosen, and offers no choice without an application', async () => {
    const wrapper = mount(MessageThread, {
      props: { messages, canAnswer: true },
      global: { plugins: [Quasar] },
    })
    expect(wrapper.find('[data-testid="answer-documents"]').exists()).toBe(false)
    await wrapper.find('textarea').setValue('  Mats are 1.5 m square.  ')
    await wrapper.find('[data-testid="answer-send"]').trigger('click')
    expect(wrapper.emitted('answer')).toEqual([['Mats are 1.5 m square.', []]])
  })
})
