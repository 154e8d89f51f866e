// Formulas an imported pad can carry to attack whoever compiles its .tex export: file reads and writes, shell
// escape, catcode and expansion tricks, leaving math mode. `read` is a file the attacker wants to see, `marker`
// a file a successful command would create.
export function hostileFormulas(read = '/etc/hostname', marker = '/tmp/bulkpad-pwned'): string[] {
	return [
		`\\input{${read}}`,
		`\\include{${read}}`,
		`x \\openin5=${read} \\read5 to \\secret \\secret`,
		`\\immediate\\write18{touch ${marker}}`,
		`\\ExplSyntaxOn \\tex_write:D 18 {touch~${marker}} \\ExplSyntaxOff`,
		`\\ExplSyntaxOn \\sys_shell_now:n {touch~${marker}} \\ExplSyntaxOff`,
		`^^5cinput{${read}}`,
		'x^^5c^^69nput',
		'x^\r^5cinput{y}',
		`\\csname input\\endcsname{${read}}`,
		'\\catcode`\\^=7 x',
		`\\def\\x{\\input}\\x{${read}}`,
		`\\let\\x=\\input \\x{${read}}`,
		`\\expandafter\\input\\string{${read}}`,
		'\\lowercase{\\INPUT}',
		`\\scantokens{\\input{${read}}}`,
		`\\directlua{os.execute("touch ${marker}")}`,
		'\\pdfprimitive\\input{x}',
		`\\special{! (${marker}) run}`,
		`\\newwrite\\w \\immediate\\openout\\w=${marker} \\immediate\\write\\w{x}`,
		`\\] \\input{${read}} \\[`,
		`\\text{$\\input{${read}}$}`,
		'\\end{document}',
		'\\begin{verbatim}x\\end{verbatim}',
		`\\begin{array}{@{\\input{${read}}}c} 1 \\end{array}`,
		'\\operatorname{\\input{x}}',
		'\\begin{array}{c} 1 \\end{matrix}',
		'\\left( x',
		'x } \\input{y} {',
		'% \\input{y}',
		'#1',
		'~\\input',
		'x\\\n\\input{y}',
		'Δ',
		'\\mathrm{\\Input}',
		'\\frac12\\usepackage{shellesc}'
	];
}
