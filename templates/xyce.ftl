<#--
  Diode card for Xyce 7.6 or later (diode level 1).
  Data: name, dialect, provenance (list of strings), parameters (list of {keyword, value}).
  Every value arrives as a finished string with its SPICE suffix; do not format numbers here.
  Only comment lines from provenance may precede .MODEL, so that a card read back writes the same bytes.
-->
<#list provenance as line>
*<#if line?has_content> ${line}</#if>
</#list>
.MODEL ${name} D (
<#list parameters as p>
+ ${p.keyword}=${p.value}
</#list>
+ )
