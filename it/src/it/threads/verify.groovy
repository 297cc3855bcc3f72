// Both executions ran and wrote the same files with the same bytes: the thread count changes how rows are made,
// not what is written.
def lines = new File(basedir, 'build.log').readLines('UTF-8')
['one-thread', 'two-threads'].each { id ->
    assert lines.any { it.startsWith('[INFO] --- ') && it.contains(':generate (' + id + ') @ threads ---') } : id
}
def one = new File(basedir, 'target/one-thread')
def two = new File(basedir, 'target/two-threads')
def names = { File root ->
    def found = []
    root.eachFileRecurse(groovy.io.FileType.FILES) { found << root.toPath().relativize(it.toPath()).toString().replace('\\', '/') }
    found.sort()
}
def expected = names(one)
assert expected.containsAll(['ferry-boardings.csv', 'ferry-boardings.report.json']) : expected
assert names(two) == expected
expected.each { name ->
    byte[] a = new File(one, name).bytes
    byte[] b = new File(two, name).bytes
    assert a.length > 0 : name
    assert Arrays.equals(a, b) : "$name differs between one and two threads"
}
// header plus one record per row (RFC 4180 section 2.3), numbered 1 .. 10000 in order
def csv = new File(two, 'ferry-boardings.csv').readLines('UTF-8')
assert csv.size() == 10001
assert csv[0] == 'boarding_no,cars,foot_pax,wait_min'
csv.drop(1).eachWithIndex { line, i -> assert line.startsWith((i + 1) + ',') : line }
true
