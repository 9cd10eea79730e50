import type { Metadata } from 'next';
import Link from 'next/link';
import { ApiReferenceViewer } from '@/components/api-reference/viewer';

export const metadata: Metadata = { title: 'API reference' };

/**
 * The human-readable API reference: the OpenAPI 3.1 document of /api/v1 shown with Swagger UI.
 * Public, like the document itself (it holds no company data); calls made from "Try it out" need
 * a key or a session like any other.
 */
export default function ApiReferencePage() {
  return (
    <div className="mx-auto max-w-6xl px-6 py-8">
      <h1 className="text-2xl font-semibold text-stone-900">FadeLedger API reference</h1>
      <p className="mt-2 max-w-3xl text-sm text-stone-700">
        Your order or CRM system can run trade-offs and read studies, quotes and customers with an API key. An admin makes keys in{' '}
        <Link href="/settings/api-keys" className="font-medium underline">
          Settings → API keys
        </Link>
        ; send one as <code>Authorization: Bearer fl_…</code>. The machine-readable description is{' '}
        <a href="/api/v1/openapi.json" className="font-medium underline">
          /api/v1/openapi.json
        </a>{' '}
        (OpenAPI 3.1).
      </p>
      <ApiReferenceViewer documentUrl="/api/v1/openapi.json" />
    </div>
  );
}
