// The failure names the spec as FILE:LINE:COLUMN (the value -3 is at line 7, column 43) and nothing is written.
def expected = 'ovens/rye-loaves.yaml:7:43: normal: sd must be > 0: -3'
def lines = new File(basedir, 'build.log').readLines('UTF-8')
assert lines.any { it == expected || it.endsWith(': ' + expected) || it.endsWith(': ' + expected + ' -> [Help 1]') } :
        "no line with <$expected> in build.log"
// A user mistake gets no stack trace (the builds run without -e, as a user's would).
assert !lines.any { it.trim().startsWith('at ') || it.contains('MojoFailureException:') }
def out = new File(basedir, 'target/generated-test-resources/standin')
assert !out.exists() || out.listFiles().length == 0
true
