// Build 2 found both specs up to date, generated nothing and left every file with build 1's backdated time.
def longAgo = 978307200000L   // 2001-01-01T00:00:00Z, set by the backdate profile of build 1
def out = new File(basedir, 'target/generated-test-resources/standin')
def files = []
out.eachFileRecurse(groovy.io.FileType.FILES) { files << it }
def names = files.collect { out.toPath().relativize(it.toPath()).toString().replace('\\', '/') }.sort()
assert names.containsAll(['dough-batches.csv', 'dough-batches.report.json', 'kitchens/oven-loads.jsonl',
                          'kitchens/oven-loads.report.json']) : names
files.each { f -> assert f.lastModified() == longAgo : "${f} was written again by build 2" }

def log = new File(basedir, 'build.log').getText('UTF-8')
// Build 1 generated both (one summary line each, with the time taken) ...
assert (log =~ /dough-batches: 400 rows \S 3 columns \S dough-batches\.csv \(\d+ bytes\) in \d+\.\d s/).count == 1
assert (log =~ /oven-loads: 120 rows \S 3 columns \S kitchens\/oven-loads\.jsonl \(\d+ bytes\) in \d+\.\d s/).count == 1
// ... and build 2 said so instead of generating.
assert log.contains('2 of 2 specs up to date, 0 to generate (-Dstandin.force regenerates all)')

// The state lists both specs with the hashes of the files as they are.
def state = new groovy.json.JsonSlurper().parse(new File(basedir,
        'target/maven-status/standin-maven-plugin/generate/default/state.json'))
assert state.specs.keySet() as List == ['dough-batches.yaml', 'kitchens/oven-loads.yml']
def csv = state.specs['dough-batches.yaml'].files.find { it.path == 'dough-batches.csv' }
assert csv.sha256 == java.security.MessageDigest.getInstance('SHA-256').digest(new File(out, 'dough-batches.csv').bytes)
        .encodeHex().toString()
true
