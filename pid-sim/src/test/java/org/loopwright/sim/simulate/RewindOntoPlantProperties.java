package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/**
 * A sweep reuses one loop per thread: rewound onto another plant, a loop that has already run must
 * give exactly (bit for bit) the trajectory a loop built for that plant gives, noise and all.
 */
class RewindOntoPlantProperties {

    private static final ControllerSettings PI = ControllerSettings.builder().gains(IdealGains.pi(0.8, 12.0))
            .samplePeriodSeconds(0.25).outputRange(-20.0, 20.0).build();

    private static Scenario scenario(TransferFunction plant) {
        return Scenario.builder().plant(plant).controller(PI).setpoint(SetpointChange.step(0.0, 2.0))
                .disturbance(new LoadStep(30.1, -1.0)).sensor(new SensorModel(0.01, 0.0, 1, 0.0, 0.02))
                .durationSeconds(60.0).build();
    }

    @Property(tries = 300)
    void aRewoundLoopRunsAsALoopBuiltForThePlant(
            @ForAll @DoubleRange(min = 0.2, max = 3.0) double firstGain,
            @ForAll @DoubleRange(min = 0.5, max = 20.0) double firstLag,
            @ForAll @DoubleRange(min = 0.0, max = 3.0) double firstDeadTime,
            @ForAll @DoubleRange(min = 0.2, max = 3.0) double gain,
            @ForAll @DoubleRange(min = 0.5, max = 20.0) double lag,
            @ForAll @DoubleRange(min = 0.1, max = 10.0) double secondLag,
            @ForAll @DoubleRange(min = 0.0, max = 3.0) double deadTime) {
        ClosedLoop reused = new ClosedLoop(scenario(TransferFunction.sopdt(firstGain, firstLag, 1.0, firstDeadTime)));
        reused.run();
        TransferFunction drawn = TransferFunction.sopdt(gain, lag, secondLag, deadTime);
        reused.rewind(drawn);
        assertSameRun(reused.run(), Simulation.run(scenario(drawn)));
    }

    /** A model the plant cannot take in place (another order, or nonlinear) gets a new plant, with the same result. */
    @Property(tries = 100)
    void aModelOfAnotherKindGetsANewPlant(@ForAll @DoubleRange(min = 0.2, max = 3.0) double gain,
            @ForAll @DoubleRange(min = 0.5, max = 20.0) double lag) {
        ClosedLoop reused = new ClosedLoop(scenario(TransferFunction.sopdt(1.0, 5.0, 1.0, 0.5)));
        reused.run();
        TransferFunction firstOrder = TransferFunction.fopdt(gain, lag, 0.3);
        reused.rewind(firstOrder);
        assertSameRun(reused.run(), Simulation.run(scenario(firstOrder)));
        TankModel tank = new TankModel(0.5, 0.01, 0.2, 0.05);
        reused.rewind(tank);
        assertSameRun(reused.run(), Simulation.run(scenario(firstOrder).withPlant(tank)));
    }

    private static void assertSameRun(Trajectory actual, Trajectory expected) {
        assertThat(actual.length()).isEqualTo(expected.length());
        assertThat(actual.times()).isEqualTo(expected.times());
        assertThat(actual.measurements()).isEqualTo(expected.measurements());
        assertThat(actual.outputs()).isEqualTo(expected.outputs());
        assertThat(actual.processOutputs()).isEqualTo(expected.processOutputs());
        assertThat(actual.diverged()).isEqualTo(expected.diverged());
    }
}
