package com.stagewise.history.record;

import java.time.Instant;
import java.util.Objects;

/**
 * A photo of the board attached to a case, as listed with the case (the picture itself is read on
 * its own, see {@link StoredPhoto}). A photo is never edited once attached.
 *
 * @param id stable id (UUID)
 * @param caseId the case it belongs to
 * @param fileName the name of the file it came from, without its folder
 * @param mediaType {@code image/png} or {@code image/jpeg}
 * @param width the picture's width in pixels
 * @param height the picture's height in pixels
 * @param bytes the size of the picture file in bytes
 * @param attachedAt when it was attached
 * @param attachedBy who attached it (may be empty)
 */
public record CasePhoto(
    String id,
    String caseId,
    String fileName,
    String mediaType,
    int width,
    int height,
    long bytes,
    Instant attachedAt,
    String attachedBy) {
  public CasePhoto {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    Times.text(fileName, "fileName");
    Times.text(mediaType, "mediaType");
    attachedAt = Times.millis(Objects.requireNonNull(attachedAt, "attachedAt"));
    Times.text(attachedBy, "attachedBy");
  }

  /** Returns this photo belonging to the case known here by another id. */
  public CasePhoto withCase(String localCaseId) {
    return new CasePhoto(
        id, localCaseId, fileName, mediaType, width, height, bytes, attachedAt, attachedBy);
  }
}
