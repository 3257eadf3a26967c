// The self-contained ES bundle of swagger-ui-dist ships no types; only what the reference uses.
declare module "swagger-ui-dist/swagger-ui-es-bundle.js" {
  type Options = {
    domNode: HTMLElement;
    /** The document's address, same origin. */
    url: string;
    validatorUrl: string | null;
    deepLinking?: boolean;
    defaultModelsExpandDepth?: number;
    tryItOutEnabled?: boolean;
    onComplete?: () => void;
  };
  export default function SwaggerUI(options: Options): unknown;
}
