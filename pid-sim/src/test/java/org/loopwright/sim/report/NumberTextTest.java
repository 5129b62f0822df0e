package org.loopwright.sim.report;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class NumberTextTest {

    /** Rounding to significant digits as a calculator shows it (common practice); no float noise, no -0. */
    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "19.990000000000002 | 4 | 19.99",
        "-0.0               | 4 | 0",
        "-0.00001           | 2 | -1e-05",
        "0.1                | 4 | 0.1",
        "2377.4             | 4 | 2377",
        "748.6499           | 4 | 748.6",
        "472300.4           | 4 | 472300",
        "19710000           | 4 | 1.971e+07",
        "0.000123456        | 3 | 0.000123",
        "0.0000123456       | 3 | 1.23e-05",
        "-0.5375            | 4 | -0.5375",
        "1.0                | 4 | 1",
        "NaN                | 4 | n/a",
        "Infinity           | 4 | n/a"})
    void significantDigitsWithoutNoise(double value, int digits, String text) {
        assertThat(NumberText.of(value, digits)).isEqualTo(text);
    }
}
