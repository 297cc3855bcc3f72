// Run 1: 7 JSON lines instead of the pom's 50 JSON rows or the spec's 500 CSV rows (-D wins over the pom).
def slurper = new groovy.json.JsonSlurper()
def cli = new File(basedir, 'target/from-command-line')
assert !new File(cli, 'flour-deliveries.csv').exists()
assert !new File(cli, 'flour-deliveries.json').exists()
def lines = new File(cli, 'flour-deliveries.jsonl').readLines('UTF-8')
assert lines.size() == 7
lines.eachWithIndex { line, i ->
    def row = slurper.parseText(line)
    assert row instanceof Map
    assert row.keySet() as List == ['delivery_no', 'sacks', 'moisture_pct']
    assert row.delivery_no == i + 1
}
def report = slurper.parse(new File(cli, 'flour-deliveries.report.json'))
assert report.rows == 7
assert report.format == 'jsonl'

// Run 2 failed naming the property and wrote nothing.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log.contains('standin.rows must be a whole number from 0 to 2^40 (1099511627776): lots')

// Run 3, without -D: the pom's 50 rows as one JSON array (RFC 8259), in the default folder.
def out = new File(basedir, 'target/generated-test-resources/standin')
assert !new File(out, 'flour-deliveries.csv').exists()
def rows = slurper.parse(new File(out, 'flour-deliveries.json'))
assert rows instanceof List && rows.size() == 50
assert rows[49].delivery_no == 50
assert slurper.parse(new File(out, 'flour-deliveries.report.json')).rows == 50
true
