// swagger-ui-dist ships no types: the prebuilt Swagger UI bundle and the options this app passes.
declare module 'swagger-ui-dist/swagger-ui-es-bundle.js' {
  type SwaggerUIOptions = {
    domNode: HTMLElement;
    url: string;
    docExpansion?: 'list' | 'full' | 'none';
    defaultModelsExpandDepth?: number;
    deepLinking?: boolean;
    persistAuthorization?: boolean;
    tryItOutEnabled?: boolean;
    validatorUrl?: string | null;
  };
  const SwaggerUI: (options: SwaggerUIOptions) => unknown;
  export default SwaggerUI;
}
