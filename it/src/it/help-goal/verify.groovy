// The help goal lists the goals and, with -Ddetail, every parameter of generate and sample with its user property.
def log = new File(basedir, 'build.log').getText('UTF-8')
assert log =~ /This plugin has \d+ goals:/
['standin:generate', 'standin:help', 'standin:sample'].each { assert log.contains(it) : it }
['specDirectory', 'outputDirectory', 'seed', 'rows', 'format', 'skip', 'force', 'spec'].each { p ->
    assert log =~ /(?m)^\s+${p}( \(Default: [^)]*\))?$/ : "parameter ${p} is not listed"
}
['standin.specDirectory', 'standin.outputDirectory', 'standin.seed', 'standin.rows', 'standin.format', 'standin.skip',
 'standin.force', 'standin.spec'].each { assert log.contains("User property: ${it}") : it }
// every parameter says how -D and the pom combine: 7 of generate, 5 of sample (the help text is wrapped, so
// whitespace is flattened first)
assert (log.replaceAll(/\s+/, " ") =~ /wins over/).count >= 12
true
