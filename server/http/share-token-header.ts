/** Request header proxy.ts sets to the token of a /share/<token> page (and clears on every other request). */
export const SHARE_TOKEN_HEADER = 'x-fl-share-token';
