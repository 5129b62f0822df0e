import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The per-class floor of the mutation run: reads PIT's mutations.xml and fails when any class has
 * fewer than the given percentage of its mutants detected. Run by the {@code mutation} profile:
 * {@code java src/build/MutationFloor.java target/pit-reports/mutations.xml 85}.
 */
public final class MutationFloor {

    private static final Pattern MUTATION = Pattern.compile(
            "<mutation detected='(true|false)'[^>]*>.*?<mutatedClass>([^<]+)</mutatedClass>", Pattern.DOTALL);

    private MutationFloor() {
    }

    public static void main(String[] args) throws Exception {
        String xml = Files.readString(Path.of(args[0]));
        double floor = Double.parseDouble(args[1]);
        Map<String, int[]> byClass = new TreeMap<>();
        Matcher m = MUTATION.matcher(xml);
        while (m.find()) {
            String outer = m.group(2).replaceAll("\\$.*", "");
            int[] counts = byClass.computeIfAbsent(outer, k -> new int[2]);
            counts[0] += m.group(1).equals("true") ? 1 : 0;
            counts[1]++;
        }
        boolean below = false;
        for (Map.Entry<String, int[]> e : byClass.entrySet()) {
            double score = 100.0 * e.getValue()[0] / e.getValue()[1];
            if (score < floor) {
                below = true;
                System.out.printf("%s: %.1f %% of %d mutants detected, below the floor of %.0f %%%n", e.getKey(),
                        score, e.getValue()[1], floor);
            }
        }
        if (below) {
            System.exit(1);
        }
        System.out.printf("every one of %d classes at or above %.0f %% of mutants detected%n", byClass.size(), floor);
    }
}
