import { useId, type ReactNode } from 'react';
import { ClippedText } from '../../../components/ui/clipped-text.tsx';
import { Badge } from '../../../components/ui/layout.tsx';
import { blocksImport, type ColumnDecision, type PreviewColumn } from '../column-decisions.ts';

const REASONS: Record<NonNullable<PreviewColumn['attention']>['code'], string> = {
  computed_index: 'Probably a computed index',
  balance_element: 'The balance of the method',
  not_in_method: 'Not in the method',
};

type Action = ColumnDecision['action'];

const INPUT = 'w-20 rounded-md border border-ash-200 bg-white px-2 py-1 font-mono text-sm focus:border-ember-500 focus:outline-none';

/** One flagged column: why it is flagged, and the four choices. */
export function ColumnDecisionChoice({
  column,
  decision,
  suggestedKey,
  problem,
  disabled,
  onChange,
}: {
  column: PreviewColumn;
  decision: ColumnDecision | undefined;
  suggestedKey: string;
  problem: string | null;
  disabled: boolean;
  onChange: (decision: ColumnDecision) => void;
}) {
  const id = useId();
  const choose = (action: Action) => {
    if (action === 'element') onChange({ action, element: '' });
    else if (action === 'field') onChange({ action, key: suggestedKey });
    else onChange({ action });
  };
  const option = (action: Action, label: string, extra?: ReactNode) => (
    <label className="flex flex-wrap items-center gap-2 text-sm">
      <input
        type="radio"
        name={id}
        value={action}
        checked={decision?.action === action}
        onChange={() => choose(action)}
        disabled={disabled}
        className="accent-ember-600"
      />
      <span>{label}</span>
      {decision?.action === action && extra}
    </label>
  );
  return (
    <fieldset
      className="rounded-md border border-ash-200 bg-white p-3"
      data-testid="column-decision"
      data-header={column.header}
      aria-describedby={`${id}-why`}
    >
      <legend className="flex flex-wrap items-center gap-2 px-1 text-sm font-semibold">
        <ClippedText text={column.header} className="font-mono" />
        <Badge tone="accent">{REASONS[column.attention!.code]}</Badge>
        {blocksImport(column) && <Badge tone="bad">required</Badge>}
      </legend>
      <p id={`${id}-why`} className="mb-2 text-sm text-slag-700">
        {column.attention!.message}
      </p>
      <div className="grid gap-1.5 sm:grid-cols-2">
        {option('ignore', 'Ignore it: do not import this column')}
        {option(
          'element',
          'Read it as another element:',
          decision?.action === 'element' && (
            <input
              aria-label={`Element for ${column.header}`}
              className={INPUT}
              value={decision.element}
              maxLength={2}
              placeholder="Cr"
              onChange={(e) => onChange({ action: 'element', element: e.target.value })}
              disabled={disabled}
            />
          ),
        )}
        {option(
          'field',
          'Keep it as an identification field:',
          decision?.action === 'field' && (
            <input
              aria-label={`Field name for ${column.header}`}
              className={`${INPUT} w-48`}
              value={decision.key}
              maxLength={40}
              onChange={(e) => onChange({ action: 'field', key: e.target.value })}
              disabled={disabled}
            />
          ),
        )}
        {option('keep', `Keep it as read: element ${column.element ?? ''}, in ${column.unit ?? '%'}`)}
      </div>
      {decision?.action === 'field' && (
        <p className="mt-2 text-xs text-slag-500">
          A field holds one value per sample: the first burn&apos;s is kept, and the report warns where later burns differ.
        </p>
      )}
      {problem && (
        <p role="alert" className="mt-2 text-xs font-medium text-oxide-600">
          ⚠ {problem}
        </p>
      )}
    </fieldset>
  );
}
