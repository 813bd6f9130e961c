// How drift correction works, as the API reference states it. Each rule names its basis.
export const CORRECTION_MATH_DOC = [
  '**How a correction is computed** (per element of the method; values in %):',
  '- `two_point`: slope α = (H⁰ − L⁰)/(H − L), offset β = L⁰ − α·L, with H⁰, L⁰ the nominal values of the `high` and `low` references and H, L the exact means of their burns. `one_point_factor`: α = N/M, β = 0. `one_point_offset`: α = 1, β = N − M. `type` (reference of kind `type`, similar composition; multiplicative): t = N/(α₀·M + β₀) on top of the set in force (α₀, β₀; identity when none), stored as α = t·α₀, β = t·β₀. (Math as practised; no readable standard gives it — from memory.)',
  '- α is computed with decimal.js at 60 significant digits and stored as a decimal string rounded half-even to 20 significant digits; β is stored to 20 decimal places. corrected = α·x + β is computed exactly, so correcting each burn and then averaging equals averaging and then correcting.',
  '- H = L (or equal nominal values, or a zero to divide by) → 422 naming the element; nothing is stored.',
  '- Only numeric burns of a reference count; "<", ">" and n.d. cells of a reference are ignored.',
].join('\n');

export const CORRECTION_FLAGS_DOC = [
  '**Flags per element** (`ok`, `warn`, `fail`; every reason is a sentence that explains itself):',
  "- |α − 1| above the method's `drift_limits.warn` (default 0.2) → `warn`; above `drift_limits.fail` (default 0.5) → `fail`. A distance equal to a limit passes. For `one_point_offset` (α = 1) the offset is judged instead, as |β| / nominal. (Common practice, no source.)",
  '- α < 0 → `fail` (the references look swapped).',
  '- `two_point` with the measured levels closer than 10 % of the higher one (|H − L| < 0.1·max(|H|, |L|)) → `warn`: burn noise then moves the slope a lot. (Common practice, no source.)',
  '- An element without a nominal value or without a numeric measurement in a reference → `warn`, and the set does not correct that element (slope and offset null): its results stay uncorrected while the set is in force.',
  "- A reference's burns that disagree — range above the ISO 5725-6 critical range f(n)·σr with the method's σr — → `warn`. (ISO 5725-6:1994 §5.2.)",
  "- Compared with the previous run: the slope moved from `previous_slope` (the set in force at the run's measurement time) by more than the method's `drift_limits.slope_change_warn` (default 0.05, i.e. 5 %) → `warn`; more than `slope_change_fail` (default 0.15) → `fail`. `slope_change` gives α / α_previous − 1 and `offset_change` β − β_previous. (Common practice, no source.)",
].join('\n');

export const CORRECTION_APPLY_DOC = [
  '**How a set is applied**',
  '- Result files and JSON pushes carry concentrations, not intensity ratios, so α·x + β is applied to the concentration of each burn (`applied_to: "concentration"`), which is valid where the analytical curve is linear.',
  "- Each burn stored after an activation gets the set in force for its instrument and method at its measurement time (`measured_at`, else the sample's creation time): the activated set with the latest `effective_from` at or before that time. Results stored before an activation are never changed by it; `POST /samples/{id}/recompute` applies another set (or none) on request, with a reason, audited.",
  '- "<" and ">" bounds are corrected like values (α·bound + β; the qualifier flips if α < 0); n.d. stays n.d.',
  '- A corrected value below 0 is kept, not clamped (clamping would bias the mean and break its linearity), and the result carries the flag `negative_after_correction`; a mean below the detection limit is reported as "<" the limit as usual.',
  '- Elements the set does not correct keep their measured values. The measured values (`values`, `raw`) and `raw_mean` are always kept.',
].join('\n');
