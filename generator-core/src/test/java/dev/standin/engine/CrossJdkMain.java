package dev.standin.engine;

import dev.standin.spec.Overrides;
import dev.standin.spec.SpecException;
import java.nio.file.Path;

/**
 * Test helper run in a child JVM by {@link CrossJdkReproducibilityTest}: generates each spec file
 * into the output folder with the public engine API and prints the JVM's version.
 * Arguments: OUTPUT_DIR SPEC_FILE...
 */
public final class CrossJdkMain {

    private CrossJdkMain() {
    }

    public static void main(String[] args) throws Exception {
        Path out = Path.of(args[0]);
        Engine engine = Engine.create(Overrides.none());
        for (int i = 1; i < args.length; i++) {
            Path spec = Path.of(args[i]);
            try {
                engine.generate(engine.compile(spec, spec.getFileName().toString(), ""), out);
            } catch (SpecException e) {
                System.out.println(e.getMessage());
                System.exit(2);
            }
        }
        System.out.println("java.version=" + System.getProperty("java.version"));
    }
}
