package org.cardwright.card;

/** A card template that cannot be found, read or run; the one-line message names the template and line. */
public final class CardTemplateException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public CardTemplateException(String message, Throwable cause) {
        super(message, cause);
    }
}
