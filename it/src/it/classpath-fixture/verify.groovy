// The test in the project read the fixture from the classpath and passed; the file was copied there.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log =~ /bench-sensors: 240 rows \S 3 columns \S house-b\/bench-sensors\.csv \(\d+ bytes\)/
assert log.contains('Tests run: 1, Failures: 0, Errors: 0, Skipped: 0')
assert new File(basedir, 'target/generated-test-resources/standin/house-b/bench-sensors.report.json').isFile()
assert new File(basedir, 'target/test-classes/house-b/bench-sensors.csv').isFile()
true
