// The data file and report are in the folder Maven started in; the spec is named as given.
assert !new File(basedir, 'pom.xml').exists()
def csv = new File(basedir, 'lamp-hours.csv')
assert csv.isFile()
def lines = csv.readLines('UTF-8')
assert lines[0] == 'lamp_no,hours'
assert lines.size() == 26
def report = new groovy.json.JsonSlurper().parse(new File(basedir, 'lamp-hours.report.json'))
assert report.spec.file == 'spare/lamp-hours.yaml'
assert report.rows == 25
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log =~ /lamp-hours: 25 rows \S 2 columns \S lamp-hours\.csv \(\d+ bytes\)/
true
