/** Words for the model shapes and statuses, shared by the Baselines screens. */
export const SHAPE_LABELS: Record<string, string> = {
  mean: 'Constant — no weather effect',
  heating: 'Heating — 3-parameter',
  cooling: 'Cooling — 3-parameter',
  'heating-cooling': 'Heating and cooling — 4/5-parameter',
  linear: 'Linear in temperature — 2-parameter',
};

export const STATUS_LABELS: Record<string, { label: string; cls: string }> = {
  accepted: { label: 'accepted', cls: 'bg-line-50 text-line-800' },
  'needs-review': { label: 'to review', cls: 'bg-ink-100 text-ink-800' },
  'failing-criteria': { label: 'fails criteria', cls: 'bg-amber-soft text-amber-ink' },
  'insufficient-data': { label: 'not enough data', cls: 'bg-brick-soft text-brick-ink' },
};

export const REASON_LABELS: Record<string, string> = {
  'no-periods': 'No usable bills in the baseline period.',
  'insufficient-temperature': 'No weather station with temperatures for enough of the bill periods.',
  'too-few-periods': 'Too few bill periods to fit a model.',
  'zero-variance': 'Use per day is the same in every period: there is nothing to explain.',
  'no-qualified-model': 'No shape gave a model with positive degree-day slopes and a non-negative base load.',
  'invalid-input': 'The bills could not be read as numbers.',
};
