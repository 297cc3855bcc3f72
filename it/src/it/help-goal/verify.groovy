// The help goal lists the goals and, with -Ddetail, every parameter of generate and sample with its user property.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log =~ /This plugin has \d+ goals:/
['standin:generate', 'standin:help', 'standin:sample'].each { assert log.contains(it) : it }
['specDirectory', 'outputDirectory', 'seed', 'rows', 'format', 'skip', 'force', 'spec', 'failOnDeviation', 'report',
 'threads'].each { p ->
    assert log =~ /(?m)^\s+${p}( \(Default: [^)]*\))?$/ : "parameter ${p} is not listed"
}
['standin.specDirectory', 'standin.outputDirectory', 'standin.seed', 'standin.rows', 'standin.format', 'standin.skip',
 'standin.force', 'standin.spec', 'standin.failOnDeviation', 'standin.report', 'standin.threads'].each {
    assert log.contains("User property: ${it}") : it
}

// Each goal lists exactly its parameters with their defaults (the help text is read from the plugin descriptor;
// generate and sample take seed, rows, format, failOnDeviation, report and threads from one shared base class).
def listed = [:]
String goal = null
def lines = log.readLines()
lines.eachWithIndex { line, i ->
    def g = line =~ /^standin:(\w+)$/
    if (g) {
        goal = g[0][1]
        listed[goal] = [:]
        return
    }
    if (line.startsWith('[INFO]')) {
        goal = null
    }
    def p = line =~ /^    (\w+)( \(Default:(.*))?$/
    if (goal != null && p) {
        String dflt = p[0][3] == null ? null : (p[0][3].trim() ?: lines[i + 1].trim())
        listed[goal][p[0][1]] = dflt == null ? null : dflt.substring(0, dflt.length() - 1)
    }
}
assert listed.generate == [failOnDeviation: 'true', force: 'false', format: null,
                           outputDirectory: '${project.build.directory}/generated-test-resources/standin', report: 'true',
                           rows: null, seed: null, skip: 'false', specDirectory: '${project.basedir}/src/test/standin',
                           threads: '0']
assert listed.sample == [failOnDeviation: 'true', format: null, outputDirectory: null, report: 'true', rows: null,
                         seed: null, spec: null, threads: '0']

// every parameter says how -D and the pom combine: all 10 of generate, all 8 of sample (the help text is wrapped, so
// whitespace is flattened first)
assert (log.replaceAll(/\s+/, " ") =~ /wins over/).count >= 18
true
