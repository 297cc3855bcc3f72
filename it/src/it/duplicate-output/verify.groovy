// "depot/tram-shifts-copy.yml" sorts before "depot/tram-shifts.yaml" ('-' is 0x2D, '.' is 0x2E), so the
// second claimant of the shared files is tram-shifts.yaml, and its line names both specs.
def lines = new File(basedir, 'build.log').readLines('UTF-8')
def hit = lines.find { it.contains('depot/tram-shifts.yaml:1:1: depot/tram-shifts.csv and depot/tram-shifts.report.json') }
assert hit : 'no line naming both specs and the shared files'
assert hit.contains('would also be written by depot/tram-shifts-copy.yml; give one of the specs another dataset name or output file')
assert !lines.any { it.trim().startsWith('at ') || it.contains('MojoFailureException:') }
def out = new File(basedir, 'target/generated-test-resources/standin')
assert !out.exists() || out.listFiles().length == 0
true
