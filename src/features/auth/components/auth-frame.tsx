import type { ReactNode } from 'react';
import { Logo } from '../../../components/ui/logo.tsx';

/** The signed-out pages' frame: the brand on the left, a small form on the right. */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="grid min-h-screen md:grid-cols-2">
      <aside className="hidden flex-col justify-between bg-slag-900 p-10 text-ash-100 md:flex">
        <div className="flex items-center gap-3">
          <Logo className="h-9 w-9" />
          <span className="text-xl font-semibold tracking-tight">Meltwire</span>
        </div>
        <div className="max-w-md space-y-3">
          <p className="font-mono text-sm text-ember-400">spark stand → results hub → everything else</p>
          <p className="text-2xl font-semibold leading-snug">
            Chemistry from every burn, averaged, drift-corrected and traceable — over one versioned API.
          </p>
        </div>
        <p className="text-xs text-slag-300">
          Results decide whether a heat ships. Review and authorise them under your laboratory&apos;s accredited procedures.
        </p>
      </aside>
      <main className="flex items-center justify-center p-6">
        <div className="w-full max-w-sm">
          <div className="mb-8 flex items-center gap-2 md:hidden">
            <Logo />
            <span className="text-lg font-semibold">Meltwire</span>
          </div>
          <h1 className="mb-6 text-2xl font-semibold tracking-tight">{title}</h1>
          {children}
        </div>
      </main>
    </div>
  );
}
