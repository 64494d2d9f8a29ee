/** Words and small pieces shown for a template in several places. */
import type { LAST_RESULT_FILTERS, TemplateCondition, TemplateView } from '~/lib/schemas/template.ts';

export const CONDITION_LABELS: Record<TemplateCondition, string> = {
  in_use: 'In use',
  worn: 'Worn',
  retired: 'Retired',
};

/** One <option> per condition, in the order above, for a condition <select>. */
export function ConditionOptions() {
  return Object.entries(CONDITION_LABELS).map(([value, label]) => (
    <option key={value} value={value}>
      {label}
    </option>
  ));
}

export const LAST_RESULT_LABELS: Record<(typeof LAST_RESULT_FILTERS)[number], string> = {
  pass: 'Passed',
  fail: 'Failed',
  never: 'Never checked',
};

/** The last Template check's date and result, in words (not colour alone). */
export function LastCheck({ template }: { template: Pick<TemplateView, 'lastCheckedOn' | 'lastCheckPassed'> }) {
  if (!template.lastCheckedOn) return <span className="text-ink-soft">Not checked</span>;
  const passed = template.lastCheckPassed === true;
  return (
    <span>
      <span className="font-mono">{template.lastCheckedOn.slice(0, 10)}</span>{' '}
      <strong className={passed ? 'text-spruce' : 'text-rosewood'}>{passed ? 'Pass' : 'Fail'}</strong>
    </span>
  );
}
