package org.loopwright.pid.testing;

import java.lang.reflect.AnnotatedElement;
import java.util.Optional;
import net.jqwik.api.lifecycle.AroundPropertyHook;
import net.jqwik.api.lifecycle.PropagationMode;
import net.jqwik.api.lifecycle.PropertyExecutionResult;
import net.jqwik.api.lifecycle.PropertyExecutor;
import net.jqwik.api.lifecycle.PropertyLifecycleContext;

/**
 * Gives every jqwik property the seed named by the system property {@value #KEY} when it is set, so
 * that two mutation runs of one commit draw the same tries and report the same score (the mutation
 * profile sets it). When it is not set, as in every ordinary test run, each property draws a fresh
 * random seed as jqwik does by default. Registered for all properties in
 * {@code META-INF/services/net.jqwik.api.lifecycle.LifecycleHook}.
 */
public final class SeedFromSystemProperty implements AroundPropertyHook {

    /** The system property holding the seed, a decimal number. */
    public static final String KEY = "loopwright.jqwik.seed";

    @Override
    public boolean appliesTo(Optional<AnnotatedElement> element) {
        return System.getProperty(KEY) != null;
    }

    @Override
    public PropagationMode propagateTo() {
        return PropagationMode.ALL_DESCENDANTS;
    }

    @Override
    public PropertyExecutionResult aroundProperty(PropertyLifecycleContext context, PropertyExecutor property) {
        context.attributes().setSeed(System.getProperty(KEY));
        return property.execute();
    }
}
