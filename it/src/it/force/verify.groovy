// Build 2 was forced: it wrote every file again although nothing had changed.
def longAgo = 978307200000L   // 2001-01-01T00:00:00Z, set by the backdate profile of build 1
def out = new File(basedir, 'target/generated-test-resources/standin')
def files = []
out.eachFileRecurse(groovy.io.FileType.FILES) { files << it }
assert files*.name.containsAll(['misting-cycles.csv', 'misting-cycles.report.json'])
files.each { f -> assert f.lastModified() > longAgo : "${f} was not written again" }
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log.contains('Regenerating every spec because standin.force is true (-Dstandin.force on the command line).')
assert (log =~ /misting-cycles: 90 rows \S 3 columns \S misting-cycles\.csv \(\d+ bytes\) in \d+\.\d s/).count == 2
assert !log.contains('up to date')
true
