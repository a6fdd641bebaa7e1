package com.stagewise.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Constructor;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * Checks a record whose {@code equals} and {@code hashCode} are written out by hand against the
 * rules of {@link Record#equals} (equal exactly when every component is: references by {@code
 * equals}, primitives as their wrapper's {@code compare} says) and against the generated hash's
 * formula (31 × the hash so far + each component's wrapper hash, from 0), so that a component added
 * later and forgotten in the hand-written methods fails here.
 */
public final class RecordEquality {
  private RecordEquality() {}

  /**
   * Checks {@code bases} and every copy of them with one component changed to one of {@code
   * others}' values for that component (by name); a copy the canonical constructor refuses or
   * normalises back is skipped, but every component must have been changed in at least one copy.
   */
  public static <R extends Record> void check(
      Class<R> type, List<R> bases, Map<String, List<Object>> others) throws Exception {
    RecordComponent[] components = type.getRecordComponents();
    Class<?>[] types = new Class<?>[components.length];
    for (int i = 0; i < components.length; i++) {
      types[i] = components[i].getType();
    }
    Constructor<R> canonical = type.getDeclaredConstructor(types);
    canonical.setAccessible(true);
    Set<String> changed = new HashSet<>();
    for (R base : bases) {
      Object[] values = values(base, components);
      R copy = canonical.newInstance(values.clone());
      assertEquals(base, copy, "a copy with the same components");
      assertEquals(base.hashCode(), copy.hashCode(), "a copy's hash");
      assertEquals(generatedHash(base, components), base.hashCode(), "the generated formula");
      for (int i = 0; i < components.length; i++) {
        for (Object other : others.getOrDefault(components[i].getName(), List.of())) {
          Object[] varied = values.clone();
          varied[i] = other;
          R different;
          try {
            different = canonical.newInstance(varied);
          } catch (InvocationTargetException refused) {
            continue;
          }
          Object kept = components[i].getAccessor().invoke(different);
          if (sameComponent(kept, values[i])) {
            continue;
          }
          changed.add(components[i].getName());
          assertNotEquals(base, different, components[i].getName() + " changed to " + other);
          assertNotEquals(different, base, components[i].getName() + " changed, the other way");
          assertEquals(generatedHash(different, components), different.hashCode());
        }
      }
    }
    for (RecordComponent c : components) {
      assertTrue(changed.contains(c.getName()), c.getName() + " was never changed in a copy");
    }
  }

  private static Object[] values(Record r, RecordComponent[] components) throws Exception {
    Object[] values = new Object[components.length];
    for (int i = 0; i < components.length; i++) {
      components[i].getAccessor().setAccessible(true);
      values[i] = components[i].getAccessor().invoke(r);
    }
    return values;
  }

  /** Boxed components compare as the record's rules do: {@code Double.equals} is compare's. */
  private static boolean sameComponent(Object a, Object b) {
    return Objects.equals(a, b);
  }

  private static int generatedHash(Record r, RecordComponent[] components) throws Exception {
    int h = 0;
    for (Object v : values(r, components)) {
      h = 31 * h + Objects.hashCode(v);
    }
    return h;
  }
}
