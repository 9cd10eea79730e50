/**
 * The campaign form's value for the default rain climate: each site's own, from the ITU-R maps at
 * its coordinates. A blank or missing value means the same.
 */
export const EACH_SITE_CLIMATE = 'maps';
/** What the form and the result call that default (the study form says the same of one site). */
export const EACH_SITE_CLIMATE_LABEL = "From each site's coordinates (ITU-R maps)";

