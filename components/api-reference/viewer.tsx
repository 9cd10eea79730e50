'use client';

import { useEffect, useRef, useState } from 'react';
import 'swagger-ui-dist/swagger-ui.css';
import './viewer.css';

/**
 * The interactive reference of /api/v1/openapi.json ("Try it out" calls this server with your key).
 *
 * Swagger UI's prebuilt bundle (swagger-ui-dist), not swagger-ui-react: the React package leaves its
 * OpenAPI 3.1 resolver (apidom) to our bundler, and Turbopack drops the side-effect module that
 * registers it, so no operation would open. The prebuilt bundle has it inside. It is served from our
 * own origin (no CDN) and runs under the page CSP: Next's nonce-bearing loader pulls the chunk in
 * ('strict-dynamic'), the stylesheet is a file, and Swagger UI needs no eval. It renders in the
 * browser only (it touches `window` when it loads).
 */
export function ApiReferenceViewer({ documentUrl }: { documentUrl: string }) {
  const node = useRef<HTMLDivElement>(null);
  // Swagger UI owns the node's children; React renders only the status line beside it.
  const [state, setState] = useState<'loading' | 'ready' | 'failed'>('loading');
  useEffect(() => {
    let cancelled = false;
    import('swagger-ui-dist/swagger-ui-es-bundle.js')
      .then(({ default: SwaggerUI }) => {
        if (cancelled || !node.current) return;
        // validatorUrl null: never send our document to an outside validator service.
        SwaggerUI({ domNode: node.current, url: documentUrl, docExpansion: 'list', defaultModelsExpandDepth: -1, deepLinking: false, persistAuthorization: false, tryItOutEnabled: false, validatorUrl: null });
        setState('ready');
      })
      .catch(() => setState('failed'));
    return () => {
      cancelled = true;
    };
  }, [documentUrl]);
  return (
    <div className="api-reference">
      {state === 'loading' && <p className="px-4 py-6 text-sm text-stone-600">Loading the API reference…</p>}
      {state === 'failed' && (
        <p className="px-4 py-6 text-sm text-red-700">
          The interactive reference could not load. The description itself is at <a href={documentUrl}>{documentUrl}</a>.
        </p>
      )}
      <div ref={node} />
    </div>
  );
}
