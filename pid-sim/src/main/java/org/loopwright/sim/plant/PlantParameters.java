package org.loopwright.sim.plant;

import java.lang.reflect.Constructor;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;
import java.util.Map;

import org.loopwright.sim.config.FileKey;

/**
 * A nonlinear plant model's parameters read and scaled by their file keys. Each key names the model
 * field it fills ({@link FileKey#field()}), which is the model record's component of that name, so the
 * scenario file's declarations are the one list of what a parameter is called and where it lives.
 *
 * <p>Example: the gimbal motor with its static friction 1.2 times the nominal one:
 * {@code PlantParameters.scaled(motor, Map.of(staticFrictionKey, 1.2))}.
 *
 * <p>Thread-safe: stateless.
 */
public final class PlantParameters {

    private PlantParameters() {
    }

    /**
     * The value of one parameter.
     *
     * @param model a nonlinear plant model
     * @param key   one of {@code model.type().spreadKeys()}
     * @return the value the model holds
     */
    public static double value(PlantModel model, FileKey<Double> key) {
        return (Double) read(component(model, key), model);
    }

    /**
     * The model with some parameters multiplied by factors; a factor of exactly 1 keeps the value bit
     * for bit, so all-ones give back an equal model.
     *
     * @param model   a nonlinear plant model
     * @param factors factor per key, each key one of {@code model.type().spreadKeys()}
     * @return the scaled model
     * @throws org.loopwright.pid.InvalidSettingException when the model refuses the scaled values (it names the field)
     */
    public static PlantModel scaled(PlantModel model, Map<FileKey<Double>, Double> factors) {
        RecordComponent[] components = model.getClass().getRecordComponents();
        Object[] values = new Object[components.length];
        Class<?>[] types = new Class<?>[components.length];
        for (int i = 0; i < components.length; i++) {
            values[i] = read(components[i], model);
            types[i] = components[i].getType();
        }
        factors.forEach((key, factor) -> {
            String field = component(model, key).getName();
            for (int i = 0; i < components.length; i++) {
                if (components[i].getName().equals(field)) {
                    values[i] = (Double) values[i] * factor;
                }
            }
        });
        try {
            Constructor<?> canonical = model.getClass().getConstructor(types);
            return (PlantModel) canonical.newInstance(values);
        } catch (InvocationTargetException e) {
            if (e.getCause() instanceof RuntimeException refused) {
                throw refused;
            }
            throw new IllegalStateException("cannot rebuild " + model.type().word(), e.getCause());
        } catch (ReflectiveOperationException e) {
            throw new IllegalStateException("cannot rebuild " + model.type().word(), e);
        }
    }

    /** The record component a key fills; every nonlinear model is a record of its own fields. */
    private static RecordComponent component(PlantModel model, FileKey<Double> key) {
        if (model.type().linear() || !model.type().spreadKeys().contains(key)) {
            throw new IllegalArgumentException(key.word() + " is not a parameter a sweep may scale on plant type "
                    + model.type().word());
        }
        for (RecordComponent component : model.getClass().getRecordComponents()) {
            if (component.getName().equals(key.field()) && component.getType() == double.class) {
                return component;
            }
        }
        throw new IllegalStateException(model.getClass().getSimpleName() + " has no number field " + key.field());
    }

    private static Object read(RecordComponent component, PlantModel model) {
        try {
            return component.getAccessor().invoke(model);
        } catch (ReflectiveOperationException e) {
            throw new IllegalStateException("cannot read " + component.getName(), e);
        }
    }
}
