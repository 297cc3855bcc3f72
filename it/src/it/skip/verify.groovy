// Skipped although the pom says <skip>false</skip>: -Dstandin.skip wins. The reason is logged, nothing is written.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log.contains('Skipping Standin generation because standin.skip is true (-Dstandin.skip on the command line).')
assert !log.contains('seed-trays: ')
assert !new File(basedir, 'target/generated-test-resources/standin').exists()
assert !new File(basedir, 'target/maven-status/standin-maven-plugin').exists()
true
