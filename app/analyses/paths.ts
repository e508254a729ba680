export const analysesPath = (labSlug: string) => `/labs/${labSlug}/analyses`;
export const analysisPath = (labSlug: string, id: string) => `/labs/${labSlug}/analyses/${id}`;
export const newAnalysisPath = (labSlug: string, networkId: string, version?: number) =>
  `/labs/${labSlug}/networks/${networkId}/analyse${version !== undefined ? `?v=${version}` : ""}`;
export const sharePath = (token: string) => `/share/${token}`;
