'use client';

import dynamic from 'next/dynamic';
import 'swagger-ui-react/swagger-ui.css';
import './viewer.css';

// Swagger UI touches `window` when it loads: it renders in the browser only. Its bundle is served
// from our own origin (no CDN) and runs under the page CSP: Next's nonce-bearing loader pulls the
// chunk in ('strict-dynamic'), the stylesheet is a file, and Swagger UI needs no eval.
const SwaggerUI = dynamic(() => import('swagger-ui-react'), {
  ssr: false,
  loading: () => <p className="px-4 py-6 text-sm text-stone-600">Loading the API reference…</p>,
});

/** The interactive reference of /api/v1/openapi.json ("Try it out" calls this server with your key). */
export function ApiReferenceViewer({ documentUrl }: { documentUrl: string }) {
  return (
    <div className="api-reference">
      <SwaggerUI url={documentUrl} docExpansion="list" defaultModelsExpandDepth={-1} deepLinking={false} persistAuthorization={false} tryItOutEnabled={false} />
    </div>
  );
}
