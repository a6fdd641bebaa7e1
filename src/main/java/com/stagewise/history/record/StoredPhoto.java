package com.stagewise.history.record;

import java.util.Arrays;
import java.util.Objects;

/**
 * A photo of the board with its picture: the file's bytes exactly as attached (PNG or JPEG).
 *
 * @param photo what is known about it
 * @param image the picture file's bytes ({@code photo.bytes()} of them)
 */
public record StoredPhoto(CasePhoto photo, byte[] image) {
  public StoredPhoto {
    Objects.requireNonNull(photo, "photo");
    Objects.requireNonNull(image, "image");
    if (image.length != photo.bytes()) {
      throw new IllegalArgumentException(
          "the picture has " + image.length + " bytes, the photo says " + photo.bytes());
    }
  }

  /** Compares the picture's bytes, not the array's identity. */
  @Override
  public boolean equals(Object other) {
    return other instanceof StoredPhoto o && photo.equals(o.photo) && Arrays.equals(image, o.image);
  }

  @Override
  public int hashCode() {
    return 31 * photo.hashCode() + Arrays.hashCode(image);
  }

  @Override
  public String toString() {
    return "StoredPhoto[" + photo + ", " + image.length + " bytes]";
  }
}
