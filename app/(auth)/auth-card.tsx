import type { ReactNode } from 'react';

export function AuthCard({ title, intro, children, footer }: { title: ReactNode; intro?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <>
      <div className="rounded-md border border-stone-200 bg-white px-5 py-6 shadow-xs sm:px-7">
        <h1 className="text-xl font-semibold tracking-tight text-stone-900">{title}</h1>
        {intro && <div className="mt-1.5 text-sm text-stone-600">{intro}</div>}
        <div className="mt-5">{children}</div>
      </div>
      {footer && <div className="mt-4 text-center text-sm text-stone-600">{footer}</div>}
    </>
  );
}
