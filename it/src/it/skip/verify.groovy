// Skipped: the reason is logged and nothing is written.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log.contains('Skipping Standin generation because standin.skip is true.')
assert !log.contains('seed-trays: ')
assert !new File(basedir, 'target/generated-test-resources/standin').exists()
true
