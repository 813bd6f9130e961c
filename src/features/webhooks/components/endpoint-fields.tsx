import { ApiProblem } from '../../../api/problem.ts';
import { EventTypeValues } from '../../../api/openapi-enums.ts';
import { TextField } from '../../../components/ui/field.tsx';
import type { EventType } from '../api/endpoints.ts';

export interface EndpointDraft {
  url: string;
  description: string;
  event_types: EventType[];
  enabled: boolean;
}

export const ENDPOINT_FIELDS = ['url', 'description', 'event_types', 'enabled'];

/** The fields of an endpoint, for the create and the edit form, with the problem's messages beside each. */
export function EndpointFields({
  draft,
  onChange,
  error,
}: {
  draft: EndpointDraft;
  onChange: (draft: EndpointDraft) => void;
  error: unknown;
}) {
  const problem = error instanceof ApiProblem ? error : undefined;
  const typesError = problem?.fieldError('event_types');
  function toggle(type: EventType) {
    const types = draft.event_types.includes(type) ? draft.event_types.filter((t) => t !== type) : [...draft.event_types, type];
    onChange({ ...draft, event_types: types });
  }
  return (
    <>
      <TextField
        label="URL"
        type="url"
        placeholder="https://mes.example.test/hooks/meltwire"
        value={draft.url}
        onChange={(e) => onChange({ ...draft, url: e.target.value })}
        error={problem?.fieldError('url')}
        hint="Meltwire POSTs each event here. https is required in production."
      />
      <TextField
        label="Description (optional)"
        value={draft.description}
        onChange={(e) => onChange({ ...draft, description: e.target.value })}
        error={problem?.fieldError('description')}
      />
      <fieldset aria-describedby={typesError ? 'event-types-error' : undefined}>
        <legend className="mb-1 text-sm font-medium text-slag-800">Event types</legend>
        <div className="grid grid-cols-2 gap-1">
          {EventTypeValues.map((type) => (
            <label key={type} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={draft.event_types.includes(type)}
                onChange={() => toggle(type)}
                className="accent-ember-600"
              />
              <code className="text-xs">{type}</code>
            </label>
          ))}
        </div>
        {typesError && (
          <p id="event-types-error" role="alert" className="mt-1 text-xs font-medium text-oxide-600">
            ⚠ {draft.event_types.length === 0 ? 'Choose at least one event type.' : typesError}
          </p>
        )}
      </fieldset>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={draft.enabled}
          onChange={(e) => onChange({ ...draft, enabled: e.target.checked })}
          className="accent-ember-600"
        />
        Enabled (deliver new events)
      </label>
    </>
  );
}
