package com.stagewise.interchange.history;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.history.Checks;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.interchange.JsonField;
import java.util.Base64;
import java.util.List;

/**
 * The photos of a history bundle (format version 4; the readings taken again after the repair are
 * {@link AfterRepairFields}). Each photo's record and its picture in Base64 (RFC 4648), cut into
 * pieces of at most {@link #PIECE} characters so that no string in a bundle is longer than a stage
 * sheet may be. A bundle of an earlier version has none.
 */
final class PhotoFields {
  static final List<String> PHOTO =
      List.of(
          "id",
          "caseId",
          "fileName",
          "mediaType",
          "width",
          "height",
          "attachedAt",
          "attachedBy",
          "image");

  /**
   * The longest piece of a picture's Base64 text (a multiple of 4, so each piece decodes alone).
   */
  static final int PIECE = 1_000_000;

  private PhotoFields() {}

  /** Reads one entry of {@code photos}. */
  static StoredPhoto photo(JsonField f) {
    f.object("a photo", PHOTO);
    JsonField imageField = f.require("image", "the picture as Base64 pieces");
    List<JsonField> pieces = imageField.elements("pieces of Base64 text");
    long estimate = 0;
    for (JsonField piece : pieces) {
      estimate += piece.text().length() / 4L * 3;
      if (estimate > Checks.MAX_PHOTO_BYTES + 3) {
        throw imageField.error(
            "the photo is larger than " + Checks.megabytes(Checks.MAX_PHOTO_BYTES) + " accepted");
      }
    }
    StringBuilder base64 = new StringBuilder();
    for (JsonField piece : pieces) {
      base64.append(piece.text());
    }
    byte[] image;
    try {
      image = Base64.getDecoder().decode(base64.toString());
    } catch (IllegalArgumentException e) {
      throw imageField.error("expected the picture as Base64 text: " + e.getMessage());
    }
    return new StoredPhoto(
        new CasePhoto(
            f.require("id", "a string").text(),
            f.require("caseId", "a string").text(),
            f.require("fileName", "a string").text(),
            f.require("mediaType", "image/png or image/jpeg").text(),
            f.require("width", "the width in pixels").integer("the width in pixels"),
            f.require("height", "the height in pixels").integer("the height in pixels"),
            image.length,
            f.require("attachedAt", "a UTC time such as 2026-03-04T10:15:30Z").time(),
            f.optionalText("attachedBy", "")),
        image);
  }

  /** Writes one entry of {@code photos}. */
  static ObjectNode tree(StoredPhoto p) {
    CasePhoto about = p.photo();
    ObjectNode o = JsonNodeFactory.instance.objectNode();
    o.put("id", about.id())
        .put("caseId", about.caseId())
        .put("fileName", about.fileName())
        .put("mediaType", about.mediaType())
        .put("width", about.width())
        .put("height", about.height())
        .put("attachedAt", about.attachedAt().toString())
        .put("attachedBy", about.attachedBy());
    ArrayNode pieces = o.putArray("image");
    String base64 = Base64.getEncoder().encodeToString(p.image());
    for (int from = 0; from < base64.length(); from += PIECE) {
      pieces.add(base64.substring(from, Math.min(base64.length(), from + PIECE)));
    }
    return o;
  }
}
