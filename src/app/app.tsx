import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router/dom';
import { isProblem } from '../api/problem.ts';
import { createRouter } from './router.tsx';

const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      // 4xx answers are final; retry only network trouble and server errors, once.
      retry: (count, error) => count < 1 && !(isProblem(error) && error.status >= 400 && error.status < 500),
      refetchOnWindowFocus: false,
    },
  },
});

const router = createRouter(queryClient);

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
