/**
 * Invented club data for the demo: the fields of the demo club with their cautions, and a second club
 * with people of its own (so one club's members can be shown another club's 404). Every name is made up.
 */
export const DEMO_FIELDS = {
  heronmoor: [
    {
      name: "Five Acre Meadow", latitude: 52.41873, longitude: -1.73412,
      launchDirection: "Launch towards the north-west hedge, never towards the footpath along the south side.",
      safetyAreas: "The car park and the footpath are safety areas: no landing, no flying below head height over them.",
      localRules: "Grass is cut on Mondays: no flying before noon then. Keep below 120 m; the gliding site 6 km east asks us to.",
    },
    {
      name: "Windy Ridge", latitude: 52.39106, longitude: -1.80257,
      launchDirection: "Launch into the wind from the flat top; slope landings only below the fence.",
      safetyAreas: "Sheep graze the lower slope from May: keep clear of the flock.",
      localRules: null,
    },
  ],
  kestrel: [
    {
      name: "Long Barrow Field", latitude: 51.28154, longitude: -1.91733,
      launchDirection: "Launch away from the lane, towards the barrow mound.",
      safetyAreas: "The mound itself is protected: no landing on it, no walking on it to fetch a model.",
      localRules: "Flying only with the farmer's day pass (at the gate).",
    },
  ],
} as const;

export const KESTREL_CLUB = { name: "Kestrel Downs Soaring Club", slug: "kestrel-downs", homeField: "Long Barrow Field" };

export const KESTREL_PEOPLE = [
  { name: "Oren Castell", email: "oren@example.com", role: "officer" },
  { name: "Priya Halden", email: "priya@example.com", role: "coach" },
  { name: "Quinn Abara", email: "quinn@example.com", role: "member" },
  { name: "Rosa Tellen", email: "rosa@example.com", role: "member" },
] as const;

/** Coming dates for the demo club's home (after the demo season). */
export const HERONMOOR_COMING = {
  day: { day: "2027-03-13", fieldName: "Five Acre Meadow" },
  contest: { name: "Heronmoor Spring Open", startsOn: "2027-04-17", fieldName: "Five Acre Meadow" },
};
