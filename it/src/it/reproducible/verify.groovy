// Both builds wrote the same files with the same bytes.
def run1 = new File(basedir, 'target/run-1')
def run2 = new File(basedir, 'target/run-2')
def names = { File root ->
    def found = []
    root.eachFileRecurse(groovy.io.FileType.FILES) { found << root.toPath().relativize(it.toPath()).toString().replace('\\', '/') }
    found.sort()
}
// The data files and JSON reports at least (the core may write more per dataset, such as an HTML report).
def expected = names(run1)
assert expected.containsAll(['depot/wheel-checks.json', 'depot/wheel-checks.report.json', 'tram-arrivals.csv',
                             'tram-arrivals.report.json']) : expected
assert names(run2) == expected
expected.each { name ->
    byte[] a = new File(run1, name).bytes
    byte[] b = new File(run2, name).bytes
    assert a.length > 0 : name
    assert Arrays.equals(a, b) : "$name differs between the two builds"
}
true
