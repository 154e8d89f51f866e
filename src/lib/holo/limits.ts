/**
 * The engine's order limits, in one dependency-free place that the language (and the browser) may import.
 * The series are served two orders beyond what a line may ask, because an order-n check uses order n+1
 * (firstlaw's residual) and the radius estimate compares fits to MAX_ORDER and MAX_ORDER − 2.
 */

/** Highest order the series code serves (the double-precision coefficients stay within 1e−12 up to here). */
export const MAX_ORDER = 14;

/** Highest order a line may ask for (o=…): the language's maxOrder and the first law's cap. */
export const MAX_ASKED_ORDER = 12;
