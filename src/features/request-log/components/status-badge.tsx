import { Badge } from '../../../components/ui/layout.tsx';

export function StatusBadge({ status }: { status: number }) {
  return <Badge tone={status >= 400 ? 'bad' : status >= 200 && status < 300 ? 'good' : 'neutral'}>{status}</Badge>;
}
