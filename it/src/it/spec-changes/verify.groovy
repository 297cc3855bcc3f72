// Build 2 regenerated the edited spec, deleted the removed spec's files and left the unchanged spec's files alone.
def longAgo = 978307200000L   // 2001-01-01T00:00:00Z, set on every output by the backdate profile of build 1
def out = new File(basedir, 'target/generated-test-resources/standin')

// The removed spec's files are gone, and so is the folder they emptied.
assert !new File(out, 'retired').exists()

// The edited spec: 250 rows with four columns now (CSV header plus one line per row, RFC 4180 §2.3).
def sailings = new File(out, 'sailings.csv')
def lines = sailings.readLines('UTF-8')
assert lines[0] == 'sailing_no,cars,wind_knots,on_foot'
assert lines.size() == 251
assert sailings.lastModified() > longAgo

// The unchanged spec's files still carry build 1's time: they were not written again.
def tickets = []
out.eachFileMatch(~/tickets\..*/) { tickets << it }
assert tickets*.name.containsAll(['tickets.csv', 'tickets.report.json'])
tickets.each { f -> assert f.lastModified() == longAgo : "${f} was written again" }

def log = new File(basedir, 'build.log').getText('UTF-8')
// build 2 sees two specs (one was removed before generation), one of them unchanged
assert log.contains('1 of 2 specs up to date, 1 to generate (-Dstandin.force regenerates all)')
assert log =~ /sailings: 250 rows \S 4 columns \S sailings\.csv \(\d+ bytes\) in \d+\.\d s/
assert log =~ /Deleted retired\/old-timetable\.csv, retired\/old-timetable\.report\.json.* \(its spec retired\/old-timetable\.yaml is gone\)/

def state = new groovy.json.JsonSlurper().parse(new File(basedir,
        'target/maven-status/standin-maven-plugin/generate/default/state.json'))
assert state.specs.keySet() as List == ['sailings.yaml', 'tickets.yaml']
true
