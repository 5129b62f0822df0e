package org.loopwright.pid.runner;

import java.lang.management.ManagementFactory;
import java.util.Locale;
import java.util.Objects;
import java.util.StringJoiner;

import javax.management.JMException;
import javax.management.MBeanServer;
import javax.management.ObjectName;

import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;

/**
 * Optional: a runner's status registered as an MXBean on the platform MBean server, under
 * {@code org.loopwright:type=LoopRunner,name=<name>}. Nothing in the runner needs it; it uses only
 * the JDK's {@code java.management} module (a static requirement of pid-core, so a runtime image
 * without that module can still run loops, just not register them). Close the registration to
 * remove the bean. Example:
 * <pre>
 *   try (LoopStatusRegistration jmx = LoopStatusRegistration.register(runner, "bath-heater")) {
 *       ...
 *   }
 * </pre>
 *
 * <p>Thread-safe.
 */
public final class LoopStatusRegistration implements AutoCloseable {

    private final String objectName;

    private LoopStatusRegistration(String objectName) {
        this.objectName = objectName;
    }

    /**
     * Registers the runner's status.
     *
     * @param name the {@code name} key of the object name (quoted if needed)
     * @param runner the runner whose status the bean reads
     * @return the registration; close it to remove the bean
     * @throws IllegalArgumentException when the name is blank or a bean of that name is registered
     */
    public static LoopStatusRegistration register(LoopRunner runner, String name) {
        Objects.requireNonNull(runner, "runner");
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("JMX name must not be blank: name=" + name);
        }
        try {
            ObjectName objectName = new ObjectName("org.loopwright:type=LoopRunner,name=" + ObjectName.quote(name));
            ManagementFactory.getPlatformMBeanServer().registerMBean(new Bean(runner), objectName);
            return new LoopStatusRegistration(objectName.getCanonicalName());
        } catch (JMException e) {
            throw new IllegalArgumentException("cannot register the loop status over JMX: name=" + name + " ("
                    + e.getMessage() + ")", e);
        }
    }

    /** {@return the object name the status is registered under, in canonical form} */
    public String objectName() {
        return objectName;
    }

    /** Removes the bean; closing twice does nothing. */
    @Override
    public void close() {
        MBeanServer server = ManagementFactory.getPlatformMBeanServer();
        try {
            ObjectName name = new ObjectName(objectName);
            if (server.isRegistered(name)) {
                server.unregisterMBean(name);
            }
        } catch (JMException e) {
            throw new IllegalStateException("cannot unregister " + objectName + ": " + e.getMessage(), e);
        }
    }

    /** Reads a fresh status per attribute (off the loop thread, so the allocation does not matter). */
    private static final class Bean implements LoopStatusMXBean {
        private final LoopRunner runner;

        Bean(LoopRunner runner) {
            this.runner = runner;
        }

        private static String word(Enum<?> value) {
            return value.name().toLowerCase(Locale.ROOT).replace('_', '-');
        }

        @Override
        public String getState() {
            return word(runner.state());
        }

        @Override
        public String getStopReason() {
            return word(runner.stopReason());
        }

        @Override
        public long getPeriodNanos() {
            return runner.periodNanos();
        }

        @Override
        public long getTickCount() {
            return runner.status().tickCount();
        }

        @Override
        public double getSetpoint() {
            return runner.status().setpoint();
        }

        @Override
        public double getMeasurement() {
            return runner.status().measurement();
        }

        @Override
        public double getOutput() {
            return runner.status().output();
        }

        @Override
        public String getMode() {
            return word(runner.status().mode());
        }

        @Override
        public String getFault() {
            return word(runner.status().fault());
        }

        @Override
        public long getFaultCount() {
            return runner.status().faultCount();
        }

        @Override
        public long getOverrunCount() {
            return runner.status().overrunCount();
        }

        @Override
        public long getSkippedTickCount() {
            return runner.status().skippedTickCount();
        }

        @Override
        public long getFailedTickCount() {
            return runner.status().failedTickCount();
        }

        @Override
        public long getLastPeriodErrorNanos() {
            return runner.status().lastPeriodErrorNanos();
        }

        @Override
        public long getAppliedCommandCount() {
            return runner.status().appliedCommandCount();
        }

        @Override
        public long getRejectedCommandCount() {
            return runner.status().rejectedCommandCount();
        }

        @Override
        public String getConditions() {
            LoopStatus status = runner.status();
            StringJoiner joined = new StringJoiner(", ");
            for (LoopCondition c : LoopCondition.values()) {
                if (status.condition(c) != null) {
                    joined.add(c.label() + "=" + word(status.condition(c)));
                }
            }
            return joined.toString();
        }

        @Override
        public String getWorstCondition() {
            ConditionStatus worst = runner.status().worstCondition();
            return worst == null ? "" : word(worst);
        }
    }
}
