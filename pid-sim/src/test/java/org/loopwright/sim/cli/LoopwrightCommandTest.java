package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class LoopwrightCommandTest {

    @Test
    void aNamedCommandIsBuiltAlone() {
        assertThat(LoopwrightCommand.forArguments("sweep", "pump.yaml").getSubcommands()).containsOnlyKeys("sweep");
    }

    @Test
    void helpUsageAndUnknownNamesGetEveryCommand() {
        int all = LoopwrightCommand.commandLine().getSubcommands().size();
        assertThat(all).isEqualTo(12);
        assertThat(LoopwrightCommand.forArguments("help", "sweep").getSubcommands()).hasSize(all);
        assertThat(LoopwrightCommand.forArguments().getSubcommands()).hasSize(all);
        assertThat(LoopwrightCommand.forArguments("swep").getSubcommands()).hasSize(all);
    }

    @Test
    void aCommandBuiltAloneHasTheSameHelpAsAmongAll() {
        String alone = LoopwrightCommand.forArguments("sweep").getSubcommands().get("sweep").getUsageMessage();
        String amongAll = LoopwrightCommand.commandLine().getSubcommands().get("sweep").getUsageMessage();
        assertThat(alone).isEqualTo(amongAll).contains("Spread keys by plant type");
    }
}
