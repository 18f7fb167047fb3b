package org.cardwright.card;

/**
 * One exact shape a card file may have. {@link CardReader} picks the form whose opening keyword starts the file's
 * first statement, and the form reads the whole file: it must account for every statement, and refuse anything it
 * does not hold with {@link CardReader#refuse} (file, line, what the line was). Comment lines and blank lines are
 * already set aside by {@link CardText}.
 *
 * <p>Today there is one form, {@link ModelForm}: exactly one {@code .model NAME D(...)} statement. To add a form
 * (for example a {@code .subckt} holding one diode, one resistor and the {@code .model}), write a class that
 * implements this interface in this package and add an instance to {@link CardReader#FORMS}; nothing else in the
 * reader changes. A form returns a {@link ParsedCard}, never text: what reaches a simulator is written from the
 * parsed name and numbers only.
 */
interface CardForm {
    /** The statement keyword, upper case, that opens a file of this form, e.g. {@code .MODEL}. */
    String openingKeyword();

    /**
     * Reads a file whose first statement opens this form.
     *
     * @param layout the file's statements and comment lines
     * @param source the file name or label used in notices and errors
     * @throws CardFormatException naming source, line and text of the first statement or token the form refuses
     */
    ParsedCard read(CardText.Layout layout, String source, Dialect dialect);
}
