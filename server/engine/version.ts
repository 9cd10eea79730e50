/**
 * Version of the trade-off engine's numbers. Stored beside every saved study so a quote can say
 * which engine produced it; bump the minor on any change that moves a published figure.
 *
 * @example
 * ENGINE_VERSION // => '1.1.0'
 */
export const ENGINE_VERSION: string = '1.1.0';
