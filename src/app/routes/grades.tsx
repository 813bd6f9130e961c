import { useState } from 'react';
import { hasScope, useMe } from '../../api/me.ts';
import { Button } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import type { Grade } from '../../features/grades/api/grades.ts';
import { GradeForm } from '../../features/grades/components/grade-form.tsx';
import { GradesTable } from '../../features/grades/components/grades-table.tsx';

export function GradesPage() {
  const { data: me } = useMe();
  const canEdit = hasScope(me, 'grades:write');
  const [editing, setEditing] = useState<{ grade: Grade | null } | null>(null);
  return (
    <RequireScope scope="grades:read">
      <PageHeader
        title="Grades"
        description="Limits every sample naming the grade is judged against, with the decision rule stated. A change is saved as a new version; earlier verdicts keep the version they used."
        actions={canEdit && <Button onClick={() => setEditing({ grade: null })}>New grade</Button>}
      />
      <GradesTable onEdit={canEdit ? (grade) => setEditing({ grade }) : undefined} />
      {editing && <GradeForm key={editing.grade?.code ?? 'new'} grade={editing.grade} open onClose={() => setEditing(null)} />}
    </RequireScope>
  );
}
