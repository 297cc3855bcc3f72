// Run 1 (-Dstandin.report=false) wrote the data file and its JSON report but no HTML; run 2 (the default) also
// wrote <dataset>.report.html. The data file is the same either way, and each JSON report records its SHA-256,
// checked here with the JDK's own MessageDigest.
def names = { File root ->
    def found = []
    root.eachFileRecurse(groovy.io.FileType.FILES) { found << root.toPath().relativize(it.toPath()).toString().replace('\\', '/') }
    found.sort()
}
def without = new File(basedir, 'target/without-html')
def withHtml = new File(basedir, 'target/generated-test-resources/standin')
def plain = names(without)
assert plain.containsAll(['proofing-times.csv', 'proofing-times.report.json']) : plain
assert !plain.any { it.endsWith('.html') } : plain
assert names(withHtml) == (plain + ['proofing-times.report.html']).sort()
assert new File(withHtml, 'proofing-times.report.html').getText('UTF-8').contains('proofing-times')

def csv = new File(without, 'proofing-times.csv').bytes
assert csv == new File(withHtml, 'proofing-times.csv').bytes
assert new String(csv, 'UTF-8').readLines().size() == 121   // header plus one record per row (RFC 4180 section 2.3)
def sha = java.security.MessageDigest.getInstance('SHA-256').digest(csv).encodeHex().toString()
[without, withHtml].each { root ->
    def report = new groovy.json.JsonSlurper().parse(new File(root, 'proofing-times.report.json'))
    assert report.rows == 120
    assert report.files.find { it.path == 'proofing-times.csv' }.sha256 == sha
}
assert new File(basedir, 'build.log').readLines('UTF-8').count { it == '[INFO] BUILD SUCCESS' } == 2
true
