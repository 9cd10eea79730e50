/**
 * Physical and calendar constants of the link budget (server/engine/README.md §4), each named with its unit.
 *
 * @example
 * (0.01 / 100) * MINUTES_PER_YEAR // => 52.596 minutes: 0.01 % of an average year
 */

/** Speed of light in vacuum, m/s (SI definition, exact). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;
/** −10 log10 of Boltzmann's constant (1.380649e-23 J/K), dBW/(K·Hz): 228.6 as used in link budgets (server/engine/README.md §4). */
export const BOLTZMANN_DB = 228.6;
/** Minutes in an average year of 365.25 days (server/engine/README.md §4). */
export const MINUTES_PER_YEAR = 525_960;
/** Minutes in an average month, one twelfth of {@link MINUTES_PER_YEAR} (server/engine/README.md §4). */
export const MINUTES_PER_MONTH = 43_830;
