// The one statement of what a live sighting is: not deleted and placed on the map (a photo still waiting for its pin
// has no position). Every query that reads sightings for checks, zones, notices or lists of found pests uses it.
export const liveSighting = (alias: string) => `${alias}.deleted_at IS NULL AND ${alias}.status = 'placed'`;
