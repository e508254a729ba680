/** URLs of a lab's network pages (shared by server code and components). */
export const networkPath = (labSlug: string, networkId: string) => `/labs/${labSlug}/networks/${networkId}`;
