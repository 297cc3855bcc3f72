// 7 JSON lines instead of 500 CSV rows; the later bad -Dstandin.rows failed naming the property.
def out = new File(basedir, 'target/generated-test-resources/standin')
assert !new File(out, 'flour-deliveries.csv').exists()
def lines = new File(out, 'flour-deliveries.jsonl').readLines('UTF-8')
assert lines.size() == 7
def slurper = new groovy.json.JsonSlurper()
lines.eachWithIndex { line, i ->
    def row = slurper.parseText(line)
    assert row instanceof Map
    assert row.keySet() as List == ['delivery_no', 'sacks', 'moisture_pct']
    assert row.delivery_no == i + 1
}
def report = slurper.parse(new File(out, 'flour-deliveries.report.json'))
assert report.rows == 7
assert report.format == 'jsonl'
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log.contains('standin.rows must be a whole number from 0 to 2^40 (1099511627776): lots')
true
