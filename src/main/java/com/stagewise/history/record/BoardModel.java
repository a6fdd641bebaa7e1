package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * A board model: the design that units are built to, known by a name unique in the shop.
 *
 * @param id stable id (UUID)
 * @param name the model's name as the shop writes it, e.g. a maker's board name
 * @param maker the maker (may be empty)
 * @param notes free text about the model (may be empty)
 * @param updatedAt when this record was last changed (merges keep the newer edit)
 */
public record BoardModel(String id, String name, String maker, String notes, Instant updatedAt) {
  public BoardModel {
    Objects.requireNonNull(id, "id");
    Times.text(name, "name");
    Times.text(maker, "maker");
    Times.text(notes, "notes");
    updatedAt = Times.millis(Objects.requireNonNull(updatedAt, "updatedAt"));
  }
}
