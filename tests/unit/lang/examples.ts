/** The scenario of LANGUAGE.md's "Examples" section, verbatim. */
export const SPEC_EXAMPLES = [
	'use boosted d=4 zh=1 v=0.6',
	'darea l=0.4 o=1,2,3,exact',
	'sweep darea l=0.05..1.2:80 o=1,2,3,exact',
	'tent l=0.4 o=3',
	'firstlaw l=0.4 o=3',
	'coeffs darea o=4 | tex',
	'use vacuum d=2',
	'mi pair l=1 gap=0.3'
];
