/**
 * Caution texts: the standard one every result carries, and the situational ones. One wording,
 * shared by the server, the client and the permit PDF.
 */

/**
 * The caution every engine output carries first in `cautions` (design.md, "Safety").
 */
export const STANDARD_CAUTION =
  'These are screening calculations under the assumptions listed with them; they do not replace ' +
  "an engineer's assessment. The pipe owner's engineer decides whether the works may go ahead and " +
  'on what terms, and local codes, the owner\u2019s own requirements and licensed professional ' +
  'practice take precedence over these results.'

/** Shallow cover: local loads are not spread before they reach the pipe. */
export const SHALLOW_COVER_CAUTION =
  'The pipe has shallow cover: loads near it are hardly spread by the soil above it, and the ' +
  'half-space stress model is less reliable this close to the surface. Treat the surcharge ' +
  'results with extra care.'

/** Longitudinal bending and settlement are outside the cross-section checks. */
export const LONGITUDINAL_CAUTION =
  'The checks look at the pipe\u2019s cross-section. A local load over the pipe, or a fill that ' +
  'settles on soft ground, also bends the pipe along its length and strains its joints; that is ' +
  'not covered here.'

/** Groundwater and dewatering are outside the model. */
export const DEWATERING_CAUTION =
  'An excavation reaches below the recorded groundwater level. Pumping changes the water pressure ' +
  'and the effective soil stress around the pipe, and switching it off can float or load the pipe; ' +
  'that is not covered here.'

/** The baseline already fails: the stored data may be incomplete. */
export const BASELINE_CAUTION =
  'The pipe already exceeds a limit with the stored design data and no works. The stored data may ' +
  'be incomplete or the design method may differ; the owner\u2019s engineer should confirm the ' +
  'baseline before relying on these results.'

/** Jointed pipes cannot bridge an exposed span. */
export const JOINTED_SPAN_CAUTION =
  'The pipe has socketed or coupled joints that carry little bending; an exposed joint needs ' +
  'support on both sides whatever the span check says.'
