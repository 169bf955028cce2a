package spanwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Every bad value of a numeric option names the command, the option and what it accepts, exits 2
 * before any work, and never blames the scenario (common practice, no source).
 */
class OptionMessagesTest {

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "optimize --starts 0|optimize: --starts|from 1 to 1000",
        "optimize --starts 5000|optimize: --starts|from 1 to 1000",
        "optimize --starts x|optimize: --starts|from 1 to 1000",
        "optimize --iterations 0|optimize: --iterations|from 1 to 100000",
        "optimize --seconds 0|optimize: --seconds|from 1 to 86400",
        "optimize --seconds 1.5|optimize: --seconds|whole number",
        "optimize --seed 0|optimize: --seed|from 1 to",
        "optimize --tie both|optimize: --tie|\"groups\" or \"literal\"",
        "optimize --mode fast|optimize: --mode|\"auto\"",
        "analyze --seconds 0|analyze: --seconds|positive number",
        "bench --vars 0|bench: --vars|from 1 to 24",
        "bench --vars 25|bench: --vars|from 1 to 24",
        "bench --vertices 1|bench: --vertices|from 2 to",
        "bench --vertices 10 --edges 3|bench: --edges|at least --vertices − 1 = 9",
        "bench --scenarios 0|bench: --scenarios|from 1 to",
        "bench --rounds 1|bench: --rounds|from 2 to",
        "bench --seed x|bench: --seed|whole number",
        "bench optimize --leaves 0|bench optimize: --leaves|from 1 to 24",
        "bench optimize --rounds x|bench optimize: --rounds|from 1 to",
        "simulate --epsilon 0|simulate: --epsilon|strictly between 0 and 1, got 0",
        "simulate --alpha2 -2|simulate: --alpha2|finite number > 0, got -2",
        "simulate --bench --seed 1.5|simulate: --seed|whole number",
        "sweep or --starts 0|sweep: --starts|from 1 to 1000",
        "sweep or --starts 5000|sweep: --starts|from 1 to 1000",
        "sweep or --seconds 0|sweep: --seconds|from 1 to 86400",
        "sweep or --iterations 100001|sweep: --iterations|from 0 to 100000",
        "sweep or --threads 0|sweep: --threads|≥ 1",
        "sweep or --fit-last x|sweep: --fit-last|≥ 0",
        "sweep or --max-inputs x|sweep: --max-inputs|a number or 2^K",
        "sweep or --shards 0|sweep: --shards|≥ 1",
        "bounds --bench --seed x|bounds: --seed|whole number",
        "build host grid 3x4 --seed x|build host: --seed|whole number",
        "build host grid 3x4 --at-most-missing -1|build host: --at-most-missing|between 0 and"
    })
    void aBadOptionValueNamesTheOptionAndItsRange(String command, String names, String range) {
        // the page's optimiser options go through the facade, which refuses the same ranges (not clamped)
        if (command.startsWith("optimize --") && !command.contains("1.5") && !command.contains(" x")
                && !command.contains("--tie") && !command.contains("--mode")) {
            String[] w = command.split(" ");
            String answer = spanwright.facade.JsonFacade.optimizeStart(Main.readScenarioText(null),
                    "{\"" + w[1].substring(2) + "\":" + w[2] + "}");
            assertTrue(answer.contains("\"ok\":false") && answer.contains(range), answer);
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status = Main.run(command.split(" "), new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        String e = err.toString(StandardCharsets.UTF_8);
        assertEquals(2, status, e);
        assertTrue(e.startsWith("spanwright: " + names), e);
        assertTrue(e.contains(range), e);
        assertFalse(e.contains("invalid scenario"), e);
        assertEquals("", out.toString(StandardCharsets.UTF_8), "no work was done");
    }
}
