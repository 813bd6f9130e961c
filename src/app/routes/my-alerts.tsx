import { useInstruments } from '../../api/lookups.ts';
import { useMe } from '../../api/me.ts';
import { ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { useAlertPreferences } from '../../features/alerts/api/alert-preferences.ts';
import { AlertPreferencesForm } from '../../features/alerts/components/alert-preferences-form.tsx';

export function MyAlertsPage() {
  const { data: me } = useMe();
  const preferences = useAlertPreferences();
  const instruments = useInstruments();
  return (
    <>
      <PageHeader
        title="My alerts"
        description={`Which events e-mail you${me ? ` at ${me.user.email}` : ''}, for every instrument or only some.`}
      />
      {preferences.isPending || instruments.isPending ? (
        <Spinner />
      ) : preferences.error || instruments.error ? (
        <ProblemAlert error={preferences.error ?? instruments.error} />
      ) : (
        <AlertPreferencesForm
          initial={preferences.data.data}
          groupMinutes={preferences.data.group_minutes}
          instruments={instruments.data}
        />
      )}
    </>
  );
}
