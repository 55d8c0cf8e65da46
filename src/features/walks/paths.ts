// Where the scout's screens live; one place, so links and the router agree.
export const scoutPaths = {
  myFields: '/scout/fields',
  justUpload: '/scout/upload',
  field: (fieldId: string) => `/scout/fields/${fieldId}`,
  walk: (walkId: string) => `/scout/walks/${walkId}`,
  pin: (walkId: string, sightingId: string) => `/scout/walks/${walkId}/pin/${sightingId}`,
};
