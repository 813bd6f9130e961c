import { Link } from 'react-router';
import { PageHeader } from '../../components/ui/layout.tsx';
import { paths } from '../../config/paths.ts';

export function NotFoundPage() {
  return (
    <>
      <PageHeader title="Page not found" description="There is no console page at this address." />
      <Link to={paths.home} className="text-copper-700 underline">
        Back to the overview
      </Link>
    </>
  );
}
