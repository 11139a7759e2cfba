import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import { Quasar } from 'quasar'
import CautionNote from '../../../src/components/CautionNote.vue'
import UtilisationBar from '../../../src/components/UtilisationBar.vue'
import VerdictBadge from '../../../src/components/VerdictBadge.vue'

const global = { plugins: [Quasar] }

describe('VerdictBadge', () => {
  it('says each verdict in a word as well as a colour', () => {
    const words = (['clear', 'conditional', 'critical'] as const).map((verdict) => {
      const wrapper = mount(VerdictBadge, { props: { verdict }, global })
      return [wrapper.text(), wrapper.classes().find((c) => c.startsWith('bg-'))]
    })
    expect(words).toEqual([
      ['Clear', 'bg-positive'],
      ['Conditional', 'bg-warning'],
      ['Critical', 'bg-negative'],
    ])
  })
})

describe('UtilisationBar', () => {
  it('shows before and with-works values side by side with the change, and marks an overrun', () => {
    const wrapper = mount(UtilisationBar, { props: { before: 0.62, after: 1.08 }, global })
    const sides = wrapper.findAll('.utilisation__side')
    expect(sides.map((side) => side.attributes('data-side'))).toEqual(['before', 'after'])
    expect(sides[0]?.find('.utilisation__value').text()).toBe('0.62')
    expect(sides[1]?.find('.utilisation__value').text()).toBe('1.08')
    expect(sides[1]?.classes()).toContain('utilisation__side--over')
    expect(sides[0]?.classes()).not.toContain('utilisation__side--over')
    expect(wrapper.find('.utilisation__change').text()).toBe('+0.46')
  })

  it('without a before value shows only the with-works side', () => {
    const wrapper = mount(UtilisationBar, { props: { after: 0.4 }, global })
    expect(wrapper.findAll('.utilisation__side')).toHaveLength(1)
    expect(wrapper.find('.utilisation__change').exists()).toBe(false)
  })
})

describe('CautionNote', () => {
  it('shows the caution text it is given', () => {
    const text = 'Screening calculation under stated assumptions; the pipe owner decides.'
    const wrapper = mount(CautionNote, { props: { text }, global })
    expect(wrapper.text()).toContain(text)
    expect(wrapper.attributes('role')).toBe('note')
  })
})
