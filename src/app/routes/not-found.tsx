import { Link } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';

export function NotFoundPage() {
  return (
    <>
      <PageHeader title="Page not found" description="There is no console page at this address." />
      <Link to="/" className="text-copper-700 underline">
        Back to the overview
      </Link>
    </>
  );
}
