import type { ReactNode } from 'react';

export function Card({ children, className = '', as: Tag = 'section', 'aria-labelledby': labelledBy }: { children: ReactNode; className?: string; as?: 'section' | 'div' | 'article'; 'aria-labelledby'?: string }) {
  return (
    <Tag aria-labelledby={labelledBy} className={`rounded-md border border-stone-200 bg-white ${className}`}>
      {children}
    </Tag>
  );
}

export function CardHeader({ title, description, actions, id }: { title: ReactNode; description?: ReactNode; actions?: ReactNode; id?: string }) {
  return (
    <div className="flex flex-wrap items-start justify-between gap-3 border-b border-stone-200 px-4 py-3 sm:px-5">
      <div className="min-w-0">
        <h2 id={id} className="text-base font-semibold text-stone-900">
          {title}
        </h2>
        {description && <p className="mt-0.5 text-sm text-stone-600">{description}</p>}
      </div>
      {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
    </div>
  );
}

export function CardBody({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <div className={`px-4 py-4 sm:px-5 ${className}`}>{children}</div>;
}
