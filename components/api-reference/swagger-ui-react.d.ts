// swagger-ui-react ships no types: the props this app passes, nothing more.
declare module 'swagger-ui-react' {
  import type { ComponentType } from 'react';
  const SwaggerUI: ComponentType<{
    url?: string;
    docExpansion?: 'list' | 'full' | 'none';
    defaultModelsExpandDepth?: number;
    deepLinking?: boolean;
    persistAuthorization?: boolean;
    tryItOutEnabled?: boolean;
  }>;
  export default SwaggerUI;
}
